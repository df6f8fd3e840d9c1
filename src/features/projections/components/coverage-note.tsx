import { useTranslation } from 'react-i18next';
import { formatDate } from '@/lib/labels';
import { percentText } from '@/lib/duration';
import { useCoverage } from '../api/coverage';

/** Beside an 85 % date: what it promises, and how often it held when the backtest measured it. */
export function CoverageNote({ className = '' }: { className?: string }) {
  const { t } = useTranslation('projections');
  const coverage = useCoverage().data?.coverage;
  return (
    <span className={`block text-sm text-harbour-700 ${className}`} data-testid="coverage-note">
      {t('coverage.label')} (
      {coverage
        ? t('coverage.measured', { pct: percentText(coverage.p85Coverage), date: formatDate(`${coverage.measuredOn}T12:00:00Z`) })
        : t('coverage.notMeasured')}
      )
    </span>
  );
}
