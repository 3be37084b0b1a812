// `filmsweep methods`: the catalogue — methods, inputs, ranges, uncertainty, sources.
import type { Command } from 'commander';
import { describeMethod, methods, methodsFor, requireConfiguration } from '../../shared/physics/catalogue.js';
import { configurations, describeConfiguration } from '../../shared/physics/configurations.js';
import type { ValidityRange } from '../../shared/physics/types.js';
import { formatNumber, printJson } from '../format.js';

function rangeText(r: ValidityRange): string {
  const lo = r.min !== undefined ? `${formatNumber(r.min, 4)} ≤ ` : '';
  const hi = r.max !== undefined ? ` ≤ ${formatNumber(r.max, 4)}` : '';
  return `${lo}${r.input}${hi}${r.note ? ` (${r.note})` : ''}`;
}

export function register(program: Command) {
  program
    .command('methods')
    .description('list the catalogue: methods by configuration, with inputs, validity ranges, uncertainty and source')
    .option('-c, --configuration <id>', 'only this configuration')
    .option('--json', 'print JSON: {"configurations": [...], "methods": [...]}')
    .action((opts: { configuration?: string; json?: boolean }) => {
      const list = opts.configuration ? (requireConfiguration(opts.configuration), methodsFor(opts.configuration)) : methods;
      const confs = configurations.filter((c) => !opts.configuration || c.id === opts.configuration);
      if (opts.json) {
        printJson({ configurations: confs.map(describeConfiguration), methods: list.map(describeMethod) });
        return;
      }
      const out: string[] = [];
      for (const c of confs) {
        const d = describeConfiguration(c);
        out.push(`${c.id} — ${c.title}`, `  characteristic length: ${c.lengthNote}`);
        if (c.conventions) out.push(`  convention: ${c.conventions}`);
        out.push(`  dimensional inputs: ${[...d.dimensionalInputs, ...d.engineInputs].join(' ')}`);
        out.push(`  engine outputs:     ${d.engineOutputs.join(' ')}`);
        for (const m of list.filter((x) => x.configuration === c.id)) {
          out.push(`  ${m.id}  (${m.kind}, v${m.version}) ${m.title}`);
          const inputs = m.inputs.map((i) => (i.required ? i.name : `[${i.name}]`)).join(' ');
          out.push(`      inputs:  ${inputs}`);
          out.push(`      outputs: ${m.outputs.map((o) => o.name).join(' ')}`);
          if (m.ranges.length) out.push(`      valid:   ${m.ranges.map(rangeText).join('; ')}`);
          out.push(`      uncertainty: ±${formatNumber(m.uncertainty.fraction * 100, 3)} % — ${m.uncertainty.note}`);
          out.push(`      source:  ${m.source}`);
        }
        out.push('');
      }
      process.stdout.write(`${out.join('\n')}\n`);
    });
}
