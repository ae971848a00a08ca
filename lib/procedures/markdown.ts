// A small Markdown subset for step instructions: headings, paragraphs, lists, quotes, bold, italic, code
// and http(s)/mailto links. It parses to a tree rendered as React elements, so raw HTML in the text stays
// text: nothing an author writes becomes markup or script.
export type Inline =
  | { type: "text"; text: string }
  | { type: "strong"; children: Inline[] }
  | { type: "em"; children: Inline[] }
  | { type: "code"; text: string }
  | { type: "link"; href: string; children: Inline[] }
  | { type: "break" };

type Block =
  | { type: "heading"; level: 1 | 2 | 3; children: Inline[] }
  | { type: "paragraph"; children: Inline[] }
  | { type: "list"; ordered: boolean; items: Inline[][] }
  | { type: "quote"; children: Inline[] };

const SAFE_HREF = /^(https?:\/\/|mailto:)/i;

const PATTERNS: { re: RegExp; make: (m: RegExpExecArray) => Inline }[] = [
  { re: /`([^`\n]+)`/, make: (m) => ({ type: "code", text: m[1]! }) },
  { re: /\*\*(?=\S)([\s\S]+?)\*\*/, make: (m) => ({ type: "strong", children: parseInline(m[1]!) }) },
  {
    re: /\[([^\]\n]+)\]\(([^)\s]+)\)/,
    make: (m) => (SAFE_HREF.test(m[2]!) ? { type: "link", href: m[2]!, children: parseInline(m[1]!) } : { type: "text", text: m[0] }),
  },
  { re: /(?<![\w*])\*(?=\S)([^*\n]+?)\*(?![\w*])/, make: (m) => ({ type: "em", children: parseInline(m[1]!) }) },
  { re: /(?<!\w)_(?=\S)([^_\n]+?)_(?!\w)/, make: (m) => ({ type: "em", children: parseInline(m[1]!) }) },
];

export function parseInline(text: string): Inline[] {
  const out: Inline[] = [];
  let rest = text;
  while (rest) {
    let best: { index: number; length: number; node: Inline } | null = null;
    for (const p of PATTERNS) {
      const m = p.re.exec(rest);
      if (m && (!best || m.index < best.index)) best = { index: m.index, length: m[0].length, node: p.make(m) };
    }
    if (!best) {
      pushText(out, rest);
      break;
    }
    if (best.index > 0) pushText(out, rest.slice(0, best.index));
    out.push(best.node);
    rest = rest.slice(best.index + best.length);
  }
  return out;
}

function pushText(out: Inline[], text: string) {
  const lines = text.split("\n");
  lines.forEach((line, i) => {
    if (i > 0) out.push({ type: "break" });
    if (line) out.push({ type: "text", text: line });
  });
}

const BULLET = /^\s*[-*•]\s+(.*)$/;
const NUMBERED = /^\s*\d{1,3}[.)]\s+(.*)$/;
const HEADING = /^(#{1,3})\s+(.*)$/;
const QUOTE = /^>\s?(.*)$/;

export function parseMarkdown(source: string): Block[] {
  const lines = source.replace(/\r\n?/g, "\n").split("\n");
  const blocks: Block[] = [];
  let i = 0;
  while (i < lines.length) {
    const line = lines[i]!;
    if (!line.trim()) {
      i++;
      continue;
    }
    const heading = HEADING.exec(line);
    if (heading) {
      blocks.push({ type: "heading", level: heading[1]!.length as 1 | 2 | 3, children: parseInline(heading[2]!.trim()) });
      i++;
      continue;
    }
    if (BULLET.test(line) || NUMBERED.test(line)) {
      const ordered = !BULLET.test(line);
      const re = ordered ? NUMBERED : BULLET;
      const items: string[] = [];
      while (i < lines.length && lines[i]!.trim()) {
        const m = re.exec(lines[i]!);
        if (m) items.push(m[1]!);
        else if (items.length && /^\s+\S/.test(lines[i]!)) items[items.length - 1] += `\n${lines[i]!.trim()}`;
        else break;
        i++;
      }
      blocks.push({ type: "list", ordered, items: items.map((t) => parseInline(t)) });
      continue;
    }
    if (QUOTE.test(line)) {
      const quoted: string[] = [];
      while (i < lines.length && QUOTE.test(lines[i]!)) quoted.push(QUOTE.exec(lines[i++]!)![1]!);
      blocks.push({ type: "quote", children: parseInline(quoted.join("\n")) });
      continue;
    }
    const para: string[] = [];
    while (i < lines.length && lines[i]!.trim() && !HEADING.test(lines[i]!) && !BULLET.test(lines[i]!) && !NUMBERED.test(lines[i]!) && !QUOTE.test(lines[i]!)) {
      para.push(lines[i++]!);
    }
    blocks.push({ type: "paragraph", children: parseInline(para.join("\n")) });
  }
  return blocks;
}

export function plainText(source: string): string {
  const flat = (nodes: Inline[]): string =>
    nodes.map((n) => (n.type === "text" || n.type === "code" ? n.text : n.type === "break" ? " " : flat(n.children))).join("");
  return parseMarkdown(source)
    .map((b) => (b.type === "list" ? b.items.map(flat).join("; ") : flat(b.children)))
    .join(" ");
}
