// What a failed request says on screen, in the reader's language: the error's code names a
// sentence of ours when we have one; otherwise the server's own message.
import { i18n } from '@/lib/i18n';
import { ApiError } from '@/lib/api-client';

export function errorText(error: unknown): string {
  if (error instanceof ApiError) {
    const key = `common:errors.${error.code}`;
    if (i18n.exists(key)) return i18n.t(key as 'common:errors.offline');
    if (error.code === 'forbidden') return i18n.t('common:errors.forbidden_role');
    return error.message;
  }
  return i18n.t('common:errors.page');
}
