// `filmsweep init NAME`: a commented starter study file that passes validation.
import { writeFileSync } from 'node:fs';
import type { Command } from 'commander';
import { InputError } from '../../shared/physics/types.js';

export function register(program: Command) {
  program
    .command('init')
    .description('write a commented starter study file NAME.yaml to edit')
    .argument('<name>', 'study name, a slug such as glycol-heater-tube')
    .option('-o, --out <file>', 'file to write instead of NAME.yaml')
    .action(async (name: string, opts: { out?: string }) => {
      const { starterStudy } = await import('../../shared/study/starter.js');
      const text = starterStudy(name);
      const file = opts.out ?? `${name}.yaml`;
      try {
        // 'wx' fails if the file exists, so an existing study is never overwritten.
        writeFileSync(file, text, { flag: 'wx' });
      } catch (e) {
        const err = e as NodeJS.ErrnoException;
        if (err.code === 'EEXIST') throw new InputError(`${file} already exists; not overwriting it (choose another name or --out)`);
        throw new InputError(`cannot write ${file}: ${err.message}`);
      }
      process.stdout.write(`wrote ${file}; edit it, then run: filmsweep run ${file}\n`);
    });
}
