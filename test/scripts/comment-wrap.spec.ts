import { wrapComments } from '../../scripts/format/comment-wrap';

// The comment wrapper of `npm run format`: long comments are re-wrapped at word boundaries, nothing else changes.
const LONG = 'word '.repeat(30).trim(); // 149 characters
const wrap = (lines: string[]) => wrapComments('x.ts', lines.join('\n')).split('\n');

describe('comment wrapper', () => {
  it('when a // comment is too long, then it is re-wrapped under 120 with its indentation and no word lost', () => {
    const out = wrap(['function f() {', `  // ${LONG}`, '  return 1;', '}']);
    expect(out.every((l) => l.length <= 120)).toBe(true);
    expect(out.filter((l) => l.startsWith('  // '))).toHaveLength(2);
    expect(out.join(' ').match(/word/g)).toHaveLength(30);
  });

  it('when the long line is followed by more of its paragraph, then words move down and the rest keeps its breaks', () => {
    const out = wrap([`// ${LONG}`, '// end of the sentence.', '//', '// next paragraph']);
    expect(out).toEqual([
      `// ${'word '.repeat(23).trim()}`,
      '// word word word word word word word end of the sentence.',
      '//',
      '// next paragraph',
    ]);
  });

  it('when a one-line JSDoc is too long, then it becomes a block', () => {
    const out = wrap([`  /** ${LONG} */`, '  x = 1;']);
    expect(out[0]).toBe('  /**');
    expect(out[1].startsWith('   * word')).toBe(true);
    expect(out.at(-2)).toBe('   */');
  });

  it('when a JSDoc list item is too long, then its continuation hangs under the text', () => {
    const out = wrap(['/**', ` * - ${LONG}`, ' */']);
    expect(out[2].startsWith(' *   word')).toBe(true);
  });

  it('when a long trailing comment ends a code line, then it moves above the line', () => {
    const out = wrap([`  const x = 1; // ${LONG}`]);
    expect(out.at(-1)).toBe('  const x = 1;');
    expect(out[0].startsWith('  // word')).toBe(true);
  });

  it('when long text is in a string, a template, a directive or an indented block, then it is left as it is', () => {
    const src = [
      `const s = \`\n// ${LONG}\n\`;`,
      `const t = '// ${LONG}';`,
      `// eslint-disable-next-line no-console -- ${LONG}`,
      `//     ${LONG}`,
    ].join('\n');
    expect(wrapComments('x.ts', src)).toBe(src);
  });

  it('when run twice, then the second run changes nothing', () => {
    const once = wrapComments('x.ts', `// ${LONG}\n/**\n * ${LONG}\n */\nlet y = 2; // ${LONG}\n`);
    expect(wrapComments('x.ts', once)).toBe(once);
  });
});
