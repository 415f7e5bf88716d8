// Re-wraps comments longer than the line limit, which Prettier leaves alone. Only comments change: positions come
// from TypeScript's parser, so text in strings, templates and regular expressions is never taken for a comment.
// A paragraph (comment lines up to a blank comment line, a list item, an @tag or an indented block) is re-filled
// at word boundaries only when one of its lines is too long; other comments keep their hand-made breaks.
import ts from 'typescript';
import { type Line, fill, paragraphs } from './comment-paragraphs';

/** Tool directives and other comments whose text must stay on its line as it is. */
const DIRECTIVE = /^\/\/\/|^\/\/\s*(eslint|@ts-|prettier-|istanbul|#region|#endregion)/;

interface Range {
  pos: number;
  end: number;
  isLine: boolean;
}

/** Every comment in the file, found at the token boundaries where TypeScript keeps them. */
function commentRanges(sf: ts.SourceFile): Range[] {
  const text = sf.text;
  const seen = new Map<number, Range>();
  const add = (list: ts.CommentRange[] | undefined) => {
    for (const c of list ?? [])
      seen.set(c.pos, { pos: c.pos, end: c.end, isLine: c.kind === ts.SyntaxKind.SingleLineCommentTrivia });
  };
  const visit = (node: ts.Node) => {
    add(ts.getLeadingCommentRanges(text, node.pos));
    add(ts.getTrailingCommentRanges(text, node.end));
    for (const child of node.getChildren(sf)) visit(child);
  };
  visit(sf);
  return [...seen.values()].sort((a, b) => a.pos - b.pos);
}

/** The file with its over-long comments re-wrapped to `width` columns; unchanged if none is too long. */
export function wrapComments(fileName: string, text: string, width = 120): string {
  const kind = /\.[cm]?js$/.test(fileName) ? ts.ScriptKind.JS : ts.ScriptKind.TS;
  const sf = ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, false, kind);
  const lines = text.split('\n');
  const lineOf = (pos: number) => sf.getLineAndCharacterOfPosition(pos);
  const replacements = new Map<number, { count: number; with: string[] }>();
  const lineOnly: number[] = [];

  for (const r of commentRanges(sf)) {
    const start = lineOf(r.pos);
    const end = lineOf(r.end);
    const before = lines[start.line].slice(0, start.character);
    const after = lines[end.line].slice(end.character);
    const isAlone = before.trim() === '' && after.trim() === '';
    const body = text.slice(r.pos, r.end);
    if (r.isLine && isAlone) {
      if (!DIRECTIVE.test(body)) lineOnly.push(start.line);
    } else if (r.isLine && lines[start.line].length > width && !DIRECTIVE.test(body)) {
      // A trailing comment on a long code line moves above that line, with the line's indentation.
      const indent = /^\s*/.exec(before)![0];
      const moved = fill(`${indent}// `, body.slice(2), width);
      replacements.set(start.line, { count: 1, with: [...moved, before.trimEnd()] });
    } else if (!r.isLine && isAlone && start.line === end.line && lines[start.line].length > width) {
      // /** one long line */ becomes a block with one paragraph.
      const indent = /^\s*/.exec(before)![0];
      const opener = body.startsWith('/**') ? '/**' : '/*';
      const words = body.slice(opener.length, -2).trim();
      const wrapped = fill(`${indent} * `, words, width);
      replacements.set(start.line, { count: 1, with: [`${indent}${opener}`, ...wrapped, `${indent} */`] });
    } else if (!r.isLine && end.line - start.line >= 2) {
      // The lines between the opener and the closer of a block comment.
      const inner: Line[] = [];
      for (let i = start.line + 1; i < end.line; i++) inner.push(blockLine(lines[i]));
      const out = paragraphs(inner, width);
      if (out) replacements.set(start.line + 1, { count: end.line - start.line - 1, with: out });
    }
  }
  for (const run of runs(lineOnly)) {
    const out = paragraphs(
      run.map((i) => slashLine(lines[i])),
      width,
    );
    if (out) replacements.set(run[0], { count: run.length, with: out });
  }
  if (replacements.size === 0) return text;
  for (const at of [...replacements.keys()].sort((a, b) => b - a)) {
    const r = replacements.get(at)!;
    lines.splice(at, r.count, ...r.with);
  }
  return lines.join('\n');
}

/** Consecutive line numbers grouped into runs. */
function runs(lineNumbers: number[]): number[][] {
  const out: number[][] = [];
  for (const n of lineNumbers) {
    const last = out.at(-1);
    if (last && last.at(-1) === n - 1) last.push(n);
    else out.push([n]);
  }
  return out;
}

function slashLine(line: string): Line {
  const m = /^(\s*\/\/ ?)(.*)$/.exec(line)!;
  return { prefix: m[1], text: m[2], raw: line };
}

function blockLine(line: string): Line {
  const m = /^(\s*\* ?|\s*)(.*)$/.exec(line)!;
  return { prefix: m[1], text: m[2], raw: line };
}
