// Reading a study file from disk (Node only; the rest of shared/study also runs in the browser).
import { readFileSync } from 'node:fs';
import { StudyError } from './errors.js';
import { parseStudy, type ParseOptions } from './parse.js';
import type { LoadedStudy } from './types.js';

export function loadStudyFile(path: string, options?: ParseOptions): LoadedStudy {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    const reason = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a directory' : err.message;
    throw new StudyError([{ file: path, line: 1, column: 1, message: `cannot read the study file: ${reason}` }]);
  }
  return parseStudy(text, path, options);
}
