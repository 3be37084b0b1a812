// `filmsweep schema`: the JSON Schema of study files, for editors and other tools.
import type { Command } from 'commander';

export function register(program: Command) {
  program
    .command('schema')
    .description('print the JSON Schema of study files (point your editor\'s YAML plugin at it)')
    .action(async () => {
      const { studyJsonSchema } = await import('../../shared/study/schema.js');
      process.stdout.write(`${JSON.stringify(studyJsonSchema(), null, 2)}\n`);
    });
}
