import { I18nextProvider } from 'react-i18next';
import { stationI18n } from '@/features/station/i18n/station-i18n';
import { StationApp } from '@/features/station/components/station-app';

// The station tablet: full screen, outside the office shell, and it keeps working offline.
export function Component() {
  return (
    <I18nextProvider i18n={stationI18n}>
      <StationApp />
    </I18nextProvider>
  );
}
