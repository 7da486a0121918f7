import { defineEntity, p, type InferEntity } from '@mikro-orm/core';

/** A message received by the built-in capture SMTP server (development, demo and tests). */
export const OutboxMessageSchema = defineEntity({
  name: 'OutboxMessage',
  tableName: 'outbox_messages',
  properties: {
    id: p.integer().primary().autoincrement(),
    receivedAt: p.datetime().onCreate(() => new Date()),
    from: p.string().length(320),
    to: p.string().length(1000),
    subject: p.string().length(500),
    text: p.text(),
    html: p.text().nullable(),
  },
});
export type OutboxMessage = InferEntity<typeof OutboxMessageSchema>;
