// Splitting comment lines into paragraphs and filling them, for comment-wrap.ts. Only a paragraph with a line
// longer than the limit is re-filled; list items keep their hanging indent, and indented or table lines keep theirs.

/** One comment line: what comes before its text (indent, `//` or ` * `), its text, and the line as it was. */
export interface Line {
  prefix: string;
  text: string;
  raw: string;
}

interface Paragraph {
  lines: Line[];
  kind: 'text' | 'item' | 'fixed';
  hang: number;
}

const ITEM = /^(?:[-*+•]|\d+[.)]|@\S+) /;

/** Words of `text` laid out greedily after `prefix` (first line) and `hangPrefix` (the rest). */
export function fill(prefix: string, text: string, width: number, hangPrefix = prefix): string[] {
  const out: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    const lead = out.length === 0 ? prefix : hangPrefix;
    if (line && lead.length + line.length + 1 + word.length > width) {
      out.push(lead + line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  out.push((out.length === 0 ? prefix : hangPrefix) + line);
  return out.map((l) => l.trimEnd());
}

function split(lines: Line[]): Paragraph[] {
  const out: Paragraph[] = [];
  for (const line of lines) {
    const cur = out.at(-1);
    const indent = /^ */.exec(line.text)![0].length;
    const item = ITEM.exec(line.text);
    const isSame = cur !== undefined && cur.lines[0].prefix === line.prefix;
    if (line.text.trim() === '' || line.text.startsWith('|')) out.push({ lines: [line], kind: 'fixed', hang: 0 });
    else if (item) out.push({ lines: [line], kind: 'item', hang: item[0].startsWith('@') ? 2 : item[0].length });
    else if (indent > 0 && isSame && cur.kind === 'item' && indent === cur.hang) cur.lines.push(line);
    else if (indent > 0) out.push({ lines: [line], kind: 'fixed', hang: 0 });
    else if (isSame && cur.kind === 'text') cur.lines.push(line);
    else out.push({ lines: [line], kind: 'text', hang: 0 });
  }
  return out;
}

/** The lines re-filled where a paragraph has a line longer than `width`; null when nothing needs it. */
export function paragraphs(lines: Line[], width: number): string[] | null {
  let changed = false;
  const out: string[] = [];
  for (const p of split(lines)) {
    const first = p.lines.findIndex((l) => l.raw.length > width);
    if (first < 0 || p.kind === 'fixed') out.push(...p.lines.map((l) => l.raw));
    else {
      changed = true;
      out.push(...pushDown(p, first, width));
    }
  }
  return changed ? out : null;
}

// From the first long line on, words that do not fit move to the start of the next line of the paragraph, until a
// line fits; the lines above it and below that point keep their breaks, so the change stays as small as it can be.
function pushDown(p: Paragraph, first: number, width: number): string[] {
  const hangPrefix = p.lines[0].prefix + ' '.repeat(p.hang);
  const out = p.lines.slice(0, first).map((l) => l.raw);
  let carry = '';
  for (let j = first; j < p.lines.length; j++) {
    const lead = j === 0 ? p.lines[0].prefix : hangPrefix;
    const filled = fill(lead, `${carry} ${p.lines[j].text}`, width, hangPrefix);
    if (filled.length === 1 && carry === '' && p.lines[j].raw.length <= width) {
      out.push(...p.lines.slice(j).map((l) => l.raw));
      return out;
    }
    if (filled.length === 1) {
      out.push(filled[0], ...p.lines.slice(j + 1).map((l) => l.raw));
      return out;
    }
    out.push(...filled.slice(0, -1));
    carry = filled.at(-1)!.slice(hangPrefix.length);
  }
  out.push(hangPrefix + carry);
  return out;
}
