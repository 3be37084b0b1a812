// `filmsweep schema`: the JSON Schema of study files, for editors and other tools.
import type { Command } from 'commander';
import { studyJsonSchema } from '../../shared/study/schema.js';

export function register(program: Command) {
  program
    .command('schema')
    .description('print the JSON Schema of study files (point your editor\'s YAML plugin at it)')
    .action(() => {
      process.stdout.write(`${JSON.stringify(studyJsonSchema(), null, 2)}\n`);
    });
}
