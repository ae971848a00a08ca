// Renders step instructions (see markdown.ts). Text goes through React, which escapes it; only the elements
// below are ever produced, and links only to http(s) or mailto.
import { Fragment, type ReactNode } from "react";
import { parseMarkdown, type Inline } from "./markdown";

function inline(nodes: Inline[]): ReactNode[] {
  return nodes.map((n, i) => {
    switch (n.type) {
      case "text":
        return <Fragment key={i}>{n.text}</Fragment>;
      case "break":
        return <br key={i} />;
      case "code":
        return <code key={i} className="rounded bg-graphite-100 px-1 font-mono text-[0.92em]">{n.text}</code>;
      case "strong":
        return <strong key={i}>{inline(n.children)}</strong>;
      case "em":
        return <em key={i}>{inline(n.children)}</em>;
      case "link":
        return (
          <a key={i} href={n.href} rel="noopener noreferrer nofollow" target="_blank" className="font-semibold underline">
            {inline(n.children)}
          </a>
        );
    }
  });
}

export function Markdown({ source, className = "", testId }: { source: string; className?: string; testId?: string }) {
  const blocks = parseMarkdown(source);
  if (blocks.length === 0) return null;
  return (
    <div className={`space-y-2 leading-relaxed ${className}`} data-testid={testId}>
      {blocks.map((b, i) => {
        switch (b.type) {
          case "heading":
            return b.level === 1 ? (
              <h3 key={i} className="text-lg font-bold">{inline(b.children)}</h3>
            ) : b.level === 2 ? (
              <h4 key={i} className="font-bold">{inline(b.children)}</h4>
            ) : (
              <h5 key={i} className="font-semibold">{inline(b.children)}</h5>
            );
          case "paragraph":
            return <p key={i}>{inline(b.children)}</p>;
          case "quote":
            return <blockquote key={i} className="border-l-4 border-graphite-400 pl-3 text-graphite-700">{inline(b.children)}</blockquote>;
          case "list":
            return b.ordered ? (
              <ol key={i} className="list-decimal space-y-1 pl-6">{b.items.map((item, j) => <li key={j}>{inline(item)}</li>)}</ol>
            ) : (
              <ul key={i} className="list-disc space-y-1 pl-6">{b.items.map((item, j) => <li key={j}>{inline(item)}</li>)}</ul>
            );
        }
      })}
    </div>
  );
}
