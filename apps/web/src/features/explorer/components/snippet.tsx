import { snippetParts } from '@splitcase/contracts';

/** A search snippet with its hits marked: rendered as text nodes, never as HTML. */
export function Snippet({ text, className = '' }: { text: string; className?: string }) {
  return (
    <span className={className}>
      {snippetParts(text).map((p, i) =>
        p.hit ? (
          <mark key={i} className="rounded-sm bg-amber-100 px-0.5 font-medium text-graphite-950">
            {p.text}
          </mark>
        ) : (
          <span key={i}>{p.text}</span>
        ),
      )}
    </span>
  );
}
