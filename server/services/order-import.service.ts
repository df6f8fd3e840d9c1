// Orders from a CSV file: a preview that changes nothing, then the valid rows entered in one transaction.
import type { AppDeps } from '../app-deps';
import { ordersRepository } from '../repositories/orders.repository';
import { badInput } from '../errors';
import { previewOrderImport } from '@shared/domain/order-import';
import { localDate } from '@shared/domain/time-zone';
import { shipDateService } from './ship-date.service';
import { ordersService } from './orders.service';

/** Today's date where the factory is. */
function factoryToday(deps: AppDeps): string {
  return localDate(shipDateService.timeZone(deps), deps.now());
}

export const orderImportService = {
  previewImport: (deps: AppDeps, csv: string) => previewOrderImport(csv, factoryToday(deps)),

  importOrders(deps: AppDeps, csv: string, actorId: string) {
    const preview = previewOrderImport(csv, factoryToday(deps));
    if (preview.validCount === 0) {
      throw badInput(
        preview.fileErrors.join(' ') || 'No row can be imported.',
        preview.rows.flatMap((r) => r.errors.map((e) => ({ path: [r.line, e.column ?? ''], message: e.message }))),
        'nothing_to_import',
      );
    }
    const created = deps.db.transaction((tx) =>
      preview.rows
        .filter((r) => r.spec)
        .map((r) => {
          const id = ordersService.createInTx(deps, tx, r.spec!, actorId);
          return { line: r.line, id, number: ordersRepository.byId(tx, id)!.number };
        }),
    );
    return { created, skipped: preview.rows.filter((r) => !r.spec).map((r) => r.line) };
  },
};
