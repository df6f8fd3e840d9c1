import { useEffect } from 'react';
import { useTranslation } from 'react-i18next';
import { Link, useLocation } from 'react-router';
import { Flame, MonitorPlay, Radio, WifiOff } from 'lucide-react';
import { FLOOR_LEADS } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { useWall, wallQueryOptions } from '@/features/live/api/get-wall';
import { useLiveWall } from '@/features/live/api/use-live-wall';
import { WallBoard } from '@/features/live/components/wall-board';
import { ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(wallQueryOptions());

/** The supervisor's floor: the wall's picture inside the app, with the way to the big screen and the loads. */
export function Component() {
  const { t } = useTranslation('live');
  const wall = useWall();
  const status = useLiveWall();
  // the wall's "+N more" opens a list here (#needs-supervisor, #at-risk)
  const { hash } = useLocation();
  const ready = !!wall.data;
  useEffect(() => {
    if (ready && hash) document.getElementById(decodeURIComponent(hash.slice(1)))?.scrollIntoView({ block: 'start' });
  }, [ready, hash]);
  return (
    <>
      <PageHeader
        title={t('floor.title')}
        subtitle={
          <span className="flex items-center gap-2" role="status">
            {status === 'live' ? <Radio className="h-5 w-5" aria-hidden /> : <WifiOff className="h-5 w-5" aria-hidden />}
            {status === 'live' ? t('floor.live') : t('floor.reconnecting')}
          </span>
        }
        actions={
          <>
            <Link
              to={paths.loads}
              className="flex min-h-11 items-center gap-2 rounded-lg border-2 border-harbour-800 px-4 font-bold text-harbour-800 hover:bg-harbour-50"
            >
              <Flame className="h-5 w-5" aria-hidden /> {t('floor.loads')}
            </Link>
            <a href={paths.wall} className="flex min-h-11 items-center gap-2 rounded-lg bg-harbour-800 px-4 font-bold text-white hover:bg-harbour-700">
              <MonitorPlay className="h-5 w-5" aria-hidden /> {t('floor.openWall')}
            </a>
          </>
        }
      />
      {wall.isPending ? (
        <Loading />
      ) : wall.error ? (
        <ErrorPanel message={wall.error.message} />
      ) : (
        // the wall is drawn for 3 m away; at a desk the same picture is shown smaller
        <div style={{ zoom: 0.62 }}>
          <WallBoard view={wall.data} theme="light" compact />
        </div>
      )}
    </>
  );
}
