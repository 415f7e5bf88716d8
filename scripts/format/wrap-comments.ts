// `npm run format` step after Prettier: re-wraps comment lines longer than 120 characters in the given files, or in
// every TypeScript and JavaScript file of the code folders (git-tracked files only, so nothing generated is touched).
// Prints how many files changed. See comment-wrap.ts for what it changes and what it leaves. As a guard, a file is
// written only if TypeScript emits the same code for it, comments removed, before and after.
import { execFileSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import ts from 'typescript';
import { wrapComments } from './comment-wrap';

const CODE = /\.(ts|mts|cts|js|mjs|cjs)$/;

function defaultFiles(): string[] {
  const listed = execFileSync('git', ['ls-files', '-co', '--exclude-standard'], { encoding: 'utf8' });
  return listed.split('\n').filter((f) => CODE.test(f));
}

// Named files that are not code (Markdown, JSON…) are left alone: their text is not comments, and a line of a
// Markdown table once came back cut in two with comment markers.
const named = process.argv.slice(2);
const notCode = named.filter((f) => !CODE.test(f));
if (notCode.length > 0) console.log(`wrap-comments: not code, left alone: ${notCode.join(', ')}`);
const files = named.length > 0 ? named.filter((f) => CODE.test(f)) : defaultFiles();
const codeOf = (fileName: string, text: string) =>
  ts.transpileModule(text, { fileName, compilerOptions: { removeComments: true, target: ts.ScriptTarget.ESNext } })
    .outputText;

let changed = 0;
let refused = 0;
for (const file of files) {
  const text = readFileSync(file, 'utf8');
  const wrapped = wrapComments(file, text);
  if (wrapped === text) continue;
  if (codeOf(file, wrapped) !== codeOf(file, text)) {
    console.error(`wrap-comments: ${file} left as it was: re-wrapping would have changed its code`);
    refused++;
    continue;
  }
  writeFileSync(file, wrapped);
  changed++;
}
console.log(`wrap-comments: ${changed} of ${files.length} files re-wrapped`);
if (refused > 0) process.exit(1);
