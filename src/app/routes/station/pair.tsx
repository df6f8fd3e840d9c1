import { I18nextProvider } from 'react-i18next';
import { stationI18n } from '@/features/station/i18n/station-i18n';
import { PairScreen } from '@/features/station/components/pair-screen';

export function Component() {
  return (
    <I18nextProvider i18n={stationI18n}>
      <PairScreen />
    </I18nextProvider>
  );
}
