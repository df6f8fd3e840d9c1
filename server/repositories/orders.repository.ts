import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { customers } from '../db/schema/customers';
import { orders, orderSteps, payments, proofs } from '../db/schema/orders';
import { auditLog, routingTemplates } from '../db/schema/reference-data';
import { trays } from '../db/schema/trays';
import { users } from '../db/schema/users';

export type OrderRow = typeof orders.$inferSelect;
export type OrderStepRow = typeof orderSteps.$inferSelect;
export type PaymentRow = typeof payments.$inferSelect;
export type ProofRow = typeof proofs.$inferSelect;
export type CustomerRow = typeof customers.$inferSelect;

export const ordersRepository = {
  // --- customers
  customers: (db: Db) => db.select({ id: customers.id, name: customers.name }).from(customers).orderBy(asc(customers.name)).all(),
  customerById: (db: Db, id: string) => db.select().from(customers).where(eq(customers.id, id)).get(),
  customerByName: (db: Db, name: string) =>
    db
      .select()
      .from(customers)
      .where(eq(sql`lower(${customers.name})`, name.toLowerCase()))
      .get(),
  insertCustomer: (db: Db, row: typeof customers.$inferInsert) => db.insert(customers).values(row).run(),

  // --- orders
  byId: (db: Db, id: string) => db.select().from(orders).where(eq(orders.id, id)).get(),
  byNumber: (db: Db, number: string) => db.select().from(orders).where(eq(orders.number, number)).get(),
  /** the first order of a design (a reorder shares the design key of the original) */
  firstWithDesign: (db: Db, designKey: string) =>
    db.select().from(orders).where(eq(orders.designKey, designKey)).orderBy(asc(orders.createdAt), asc(orders.number)).get(),
  /** the highest numeric order number so far */
  maxNumber: (db: Db) =>
    db
      .select({ n: sql<number | null>`max(cast(${orders.number} as integer))` })
      .from(orders)
      .get()?.n ?? null,
  insert: (db: Db, row: typeof orders.$inferInsert) => db.insert(orders).values(row).run(),
  update: (db: Db, id: string, patch: Partial<typeof orders.$inferInsert>) => db.update(orders).set(patch).where(eq(orders.id, id)).run(),
  /** guarded status change: only from one of `from`; returns whether it happened */
  updateIfStatus: (db: Db, id: string, from: readonly string[], patch: Partial<typeof orders.$inferInsert>) =>
    db
      .update(orders)
      .set(patch)
      .where(and(eq(orders.id, id), inArray(orders.status, [...from])))
      .run().changes > 0,

  list: (db: Db) =>
    db
      .select({
        order: orders,
        customer: customers.name,
        trays: sql<number>`(select count(*) from ${trays} where ${trays.orderId} = ${orders.id} and ${trays.kind} = 'tray' and ${trays.parentTrayId} is null)`,
        paid: sql<number>`(select count(*) from ${payments} where ${payments.orderId} = ${orders.id})`,
        latestProofApproved: sql<
          number | null
        >`(select ${proofs.approvedAt} is not null from ${proofs} where ${proofs.orderId} = ${orders.id} order by ${proofs.revision} desc limit 1)`,
      })
      .from(orders)
      .innerJoin(customers, eq(customers.id, orders.customerId))
      .orderBy(desc(orders.createdAt))
      .all(),

  // --- routing
  steps: (db: Db, orderId: string, kind: 'tray' | 'mould') =>
    db
      .select()
      .from(orderSteps)
      .where(and(eq(orderSteps.orderId, orderId), eq(orderSteps.travellerKind, kind)))
      .orderBy(asc(orderSteps.seq))
      .all(),
  replaceSteps: (db: Db, orderId: string, kind: 'tray' | 'mould', rows: (typeof orderSteps.$inferInsert)[]) => {
    db.delete(orderSteps)
      .where(and(eq(orderSteps.orderId, orderId), eq(orderSteps.travellerKind, kind)))
      .run();
    if (rows.length) db.insert(orderSteps).values(rows).run();
  },
  template: (db: Db, process: string) => db.select().from(routingTemplates).where(eq(routingTemplates.process, process)).get(),
  templates: (db: Db) => db.select().from(routingTemplates).orderBy(asc(routingTemplates.process)).all(),
  saveTemplate: (db: Db, row: typeof routingTemplates.$inferInsert) =>
    db
      .insert(routingTemplates)
      .values(row)
      .onConflictDoUpdate({
        target: routingTemplates.process,
        set: { name: row.name, template: row.template, updatedAt: row.updatedAt, updatedBy: row.updatedBy },
      })
      .run(),

  // --- gates
  payments: (db: Db, orderId: string) =>
    db
      .select({ payment: payments, by: users.name })
      .from(payments)
      .leftJoin(users, eq(users.id, payments.recordedBy))
      .where(eq(payments.orderId, orderId))
      .orderBy(asc(payments.recordedAt))
      .all(),
  insertPayment: (db: Db, row: typeof payments.$inferInsert) => db.insert(payments).values(row).run(),
  proofs: (db: Db, orderId: string) => db.select().from(proofs).where(eq(proofs.orderId, orderId)).orderBy(asc(proofs.revision)).all(),
  proof: (db: Db, orderId: string, revision: number) =>
    db
      .select()
      .from(proofs)
      .where(and(eq(proofs.orderId, orderId), eq(proofs.revision, revision)))
      .get(),
  insertProof: (db: Db, row: typeof proofs.$inferInsert) => db.insert(proofs).values(row).run(),
  approveProof: (db: Db, id: string, patch: Pick<typeof proofs.$inferInsert, 'approvedAt' | 'approvedBy' | 'approvedByName' | 'approvalNote'>) =>
    db.update(proofs).set(patch).where(eq(proofs.id, id)).run(),
  requestProofChanges: (db: Db, id: string, patch: Pick<typeof proofs.$inferInsert, 'changesRequestedAt' | 'changesComment'>) =>
    db.update(proofs).set(patch).where(eq(proofs.id, id)).run(),

  userNames: (db: Db, ids: string[]) => (ids.length ? db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids)).all() : []),

  history: (db: Db, orderId: string, trayIds: string[]) =>
    db
      .select({ entry: auditLog, by: users.name })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.userId))
      .where(
        trayIds.length
          ? sql`(${auditLog.entity} = 'order' and ${auditLog.entityId} = ${orderId}) or (${auditLog.entity} = 'tray' and ${inArray(auditLog.entityId, trayIds)})`
          : and(eq(auditLog.entity, 'order'), eq(auditLog.entityId, orderId)),
      )
      .orderBy(asc(auditLog.at), asc(auditLog.id))
      .all(),
};
