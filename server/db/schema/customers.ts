import { sqliteTable, text } from 'drizzle-orm/sqlite-core';
import { id, createdAt, updatedAt } from './columns';

export const customers = sqliteTable('customers', {
  id: id(),
  name: text('name').notNull().unique(),
  contactName: text('contact_name'),
  contactEmail: text('contact_email'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});
