import { integer, text } from 'drizzle-orm/sqlite-core';

// Every instant is stored as epoch milliseconds (UTC): cheap to index, compare and subtract in SQL.
// The wire format is ISO 8601; conversion happens at the service boundary.
export const ms = (name: string) => integer(name, { mode: 'number' });
export const flag = (name: string) => integer(name, { mode: 'boolean' });
export const id = () => text('id').primaryKey();
export const createdAt = () => ms('created_at').notNull();
export const updatedAt = () => ms('updated_at').notNull();
