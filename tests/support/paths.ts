import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const PROJECT_ROOT = fileURLToPath(new URL('../..', import.meta.url));
/** Each test run gets its own folder (set by the global setup), so runs side by side never collide. */
export function testRoot(): string {
  return process.env.TRAYCE_TEST_ROOT ?? path.join(PROJECT_ROOT, '.tmp', 'tests', `run-${process.pid}`);
}
export const templateDb = () => path.join(testRoot(), 'template.db');
export const TEST_ADMIN = { email: 'admin@test.trayce.local', password: 'admin-password-1' };
