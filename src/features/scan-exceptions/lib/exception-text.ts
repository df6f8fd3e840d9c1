// What the refused-scans page says about one refusal: reason codes by their names, times in the
// factory's zone (the one formatter), never the stored codes or UTC.
import { refusalMessage, type PlainMessage } from '@shared/domain/scan-messages';
import type { ScanExceptionView } from '@shared/schemas/scans';

/** A reason code's name for the reader ("hold_customer" → "Customer asked to wait"). */
export type ReasonName = (code: string) => string | undefined;

/** Says a refusal in the reader's language (the route hands in the tablet's wording); English by default. */
export type DescribeRefusal = (code: ScanExceptionView['code'], params: ScanExceptionView['params'], formatTime: (iso: unknown) => string) => PlainMessage;

const REASON_PARAMS = ['holdReason', 'reason', 'scrapReason'] as const;

export function exceptionMessage(
  item: Pick<ScanExceptionView, 'code' | 'params'>,
  reasonName: ReasonName,
  formatTime: (iso: unknown) => string,
  describe: DescribeRefusal = refusalMessage,
): PlainMessage {
  const params: Record<string, unknown> = { ...item.params };
  for (const key of REASON_PARAMS) {
    const v = params[key];
    if (typeof v === 'string') params[key] = reasonName(v) ?? v;
  }
  return describe(item.code, params as typeof item.params, formatTime);
}
