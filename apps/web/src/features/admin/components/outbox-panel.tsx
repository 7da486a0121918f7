import { useState } from 'react';
import { Mail } from 'lucide-react';
import type { OutboxMessage } from '@splitcase/contracts';
import { ErrorPanel } from '@/components/error-boundary';
import { Card, EmptyState, Spinner } from '@/components/page';
import { formatDateTime } from '@/lib/format';
import { useOutbox } from '../api/outbox';

/** Turns URLs in a plain-text message into links. */
function Linkified({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s]+)/g);
  return (
    <>
      {parts.map((p, i) =>
        /^https?:\/\//.test(p) ? (
          <a key={i} href={p} className="break-all text-copper-700 underline">
            {p}
          </a>
        ) : (
          <span key={i}>{p}</span>
        ),
      )}
    </>
  );
}

export function OutboxPanel() {
  const outbox = useOutbox();
  const [openId, setOpenId] = useState<number | null>(null);
  if (outbox.isPending) return <Spinner />;
  if (outbox.isError) return <ErrorPanel error={outbox.error} />;
  if (!outbox.data.enabled) {
    return (
      <Card>
        <EmptyState icon={<Mail className="size-8" />} message="E-mail goes to the SMTP server set in SPLITCASE_SMTP_URL, so there is no local outbox to show." />
      </Card>
    );
  }
  const messages = outbox.data.messages;
  const open: OutboxMessage | undefined = messages.find((m) => m.id === openId) ?? messages[0];
  return (
    <div className="space-y-3">
      <p className="text-sm text-graphite-600">No mail server is configured, so Splitcase keeps every message it sends here instead of delivering it. Set SPLITCASE_SMTP_URL to send real e-mail.</p>
      {messages.length === 0 ? (
        <Card>
          <EmptyState icon={<Mail className="size-8" />} message="Nothing sent yet. Invitations, password resets and review requests appear here." />
        </Card>
      ) : (
        <div className="grid gap-4 lg:grid-cols-[minmax(260px,360px)_1fr]">
          <ul className="max-h-[70vh] divide-y divide-graphite-100 overflow-auto rounded-lg border border-graphite-150 bg-white">
            {messages.map((m) => (
              <li key={m.id}>
                <button type="button" onClick={() => setOpenId(m.id)} className={`block w-full px-3 py-2 text-left text-sm hover:bg-graphite-50 ${open?.id === m.id ? 'bg-copper-50' : ''}`}>
                  <span className="block truncate font-medium">{m.subject}</span>
                  <span className="block truncate text-xs text-graphite-500">
                    to {m.to} · {formatDateTime(m.receivedAt)}
                  </span>
                </button>
              </li>
            ))}
          </ul>
          {open && (
            <Card title={open.subject}>
              <div className="space-y-3 p-4 text-sm">
                <dl className="grid grid-cols-[5rem_1fr] gap-y-1 text-graphite-600">
                  <dt>From</dt>
                  <dd>{open.from}</dd>
                  <dt>To</dt>
                  <dd>{open.to}</dd>
                  <dt>Received</dt>
                  <dd>{formatDateTime(open.receivedAt)}</dd>
                </dl>
                <pre className="whitespace-pre-wrap border-t border-graphite-100 pt-3 font-sans" data-testid="outbox-body">
                  <Linkified text={open.text} />
                </pre>
              </div>
            </Card>
          )}
        </div>
      )}
    </div>
  );
}
