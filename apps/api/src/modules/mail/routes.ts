import { outboxResponse } from '@splitcase/contracts';
import { route } from '../../http/route';
import { OutboxMessageSchema } from './outbox-message.entity';

export const mailRoutes = [
  route(
    {
      method: 'get',
      path: '/api/outbox',
      tag: 'Admin',
      summary: 'Messages received by the built-in capture SMTP server (development and demo only)',
      access: ['admin'],
      response: outboxResponse,
    },
    async ({ em, deps }) => {
      const rows = deps.outboxEnabled ? await em.find(OutboxMessageSchema, {}, { orderBy: { id: 'desc' }, limit: 200 }) : [];
      return {
        enabled: deps.outboxEnabled,
        messages: rows.map((m) => ({
          id: m.id,
          receivedAt: m.receivedAt.toISOString(),
          from: m.from,
          to: m.to,
          subject: m.subject,
          text: m.text,
          html: m.html ?? null,
        })),
      };
    },
  ),
];
