// `filmsweep check FILE…`: run the studies, evaluate each file's `checks`, compare every
// result with the committed baseline, write JUnit XML; exit 3 when anything failed.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { Command } from 'commander';
import type { JUnitSuite } from '../../shared/check/index.js';
import { InputError } from '../../shared/physics/types.js';
import type { PreparedStudy } from '../../shared/runner/index.js';
import { EXIT, ExitError } from '../errors.js';
import { parseWholeNumber } from '../options.js';

interface CheckOptions {
  baseline?: string;
  updateBaseline?: boolean;
  junit?: string;
  tolerance?: number;
  workers?: number;
  db?: string;
  maxPoints?: number;
}

function parseTolerance(raw: string): number {
  const text = raw.trim();
  const n = text.endsWith('%') ? Number(text.slice(0, -1)) / 100 : Number(text);
  if (!Number.isFinite(n) || n < 0) throw new InputError(`--tolerance ${raw}: expected a relative tolerance such as 1e-6 or 0.1%`);
  return n;
}

/** `studies/<name>.baseline.json` beside the study file, or in --baseline DIR. */
export function baselineFile(studyFile: string, studyName: string, dir?: string): string {
  return join(dir ?? dirname(studyFile), `${studyName}.baseline.json`);
}

export function register(program: Command) {
  program
    .command('check')
    .description("run studies, evaluate their checks and compare every result with the committed baseline; exit 3 on any failure")
    .argument('<files...>', 'study files (YAML)')
    .option('--baseline <dir>', 'folder of baselines (default: beside each study file, <name>.baseline.json)')
    .option('--update-baseline', 'write the baselines from this run instead of comparing')
    .option('--tolerance <rel>', "relative tolerance for the baseline comparison (default: the study's baseline.tolerance)", parseTolerance)
    .option('--junit <file>', 'write a JUnit XML report')
    .option('-w, --workers <n>', 'worker threads (default: the number of CPUs)', parseWholeNumber)
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .option('--max-points <n>', 'refuse a study with more points than this', parseWholeNumber)
    .action(async (files: string[], opts: CheckOptions) => {
      // Each command loads its dependencies when it runs, not with every `filmsweep` start.
      const { compareWithBaseline, evaluateChecks, junitXml, makeBaseline, outcomeCases, parseBaseline, serializeBaseline } = await import(
        '../../shared/check/index.js'
      );
      const { closeStore, getRunRows, openStore, resolveDbPath } = await import('../../shared/db/index.js');
      const { prepareStudy, runStudy } = await import('../../shared/runner/index.js');
      const { loadStudyFile } = await import('../../shared/study/index.js');
      const { writeFileAtomic } = await import('../write-file.js');
      const { sweepWithReporting } = await import('../sweep-report.js');
      // Validate every file (and every baseline) before running anything.
      const prepared = files.map((file) => prepareStudy(loadStudyFile(file, { maxPoints: opts.maxPoints })));
      const baselines = prepared.map((p) => {
        const path = baselineFile(p.loaded.file, p.loaded.study.name, opts.baseline);
        if (opts.updateBaseline || !existsSync(path)) return { path, baseline: undefined };
        return { path, baseline: parseBaseline(readFileSync(path, 'utf8'), path) };
      });

      const store = await openStore(resolveDbPath(opts.db));
      const done: { prepared: PreparedStudy; runId: number; seconds: number }[] = [];
      try {
        await sweepWithReporting(store, { workers: opts.workers }, async function* (options, interrupted) {
          for (const p of prepared) {
            if (interrupted()) break;
            const outcome = await runStudy(store, p, options);
            done.push({ prepared: p, runId: outcome.id, seconds: outcome.seconds });
            yield outcome;
          }
        });

        const suites: JUnitSuite[] = [];
        let failures = 0;
        for (const [i, { prepared: p, runId, seconds }] of done.entries()) {
          const { study, file } = p.loaded;
          const data = await getRunRows(store, runId);
          const checks = evaluateChecks(study.checks, data.rows);
          const { path, baseline } = baselines[i];
          const lines: string[] = [];
          let baselineOutcomes: { name: string; passed: boolean; message: string }[] = [];
          if (opts.updateBaseline) {
            writeFileAtomic(path, serializeBaseline(makeBaseline(data)));
            lines.push(`  baseline written: ${path} (${data.rows.length} rows)`);
          } else if (!baseline) {
            baselineOutcomes = [{ name: 'baseline', passed: false, message: `no baseline at ${path}; create it with --update-baseline and commit it` }];
          } else {
            baselineOutcomes = compareWithBaseline(baseline, data.rows, {
              tolerance: opts.tolerance ?? study.baseline.tolerance,
              methods: data.run.methods,
            });
          }
          const all = [...checks, ...baselineOutcomes];
          const failed = all.filter((o) => !o.passed);
          failures += failed.length;
          const passedChecks = checks.filter((c) => c.passed).length;
          const passedBaseline = baselineOutcomes.filter((c) => c.passed).length;
          process.stdout.write(
            `${failed.length ? 'FAIL' : 'ok  '}  ${file} (run ${runId}): checks ${passedChecks}/${checks.length}` +
              (opts.updateBaseline ? '' : `, baseline ${passedBaseline}/${baselineOutcomes.length} methods`) +
              '\n',
          );
          for (const o of failed) lines.push(`  ✗ ${o.name}: ${o.message.split('\n').join('\n      ')}`);
          if (lines.length) process.stdout.write(`${lines.join('\n')}\n`);
          suites.push({
            name: `${study.name} (${file})`,
            cases: [...outcomeCases(checks, study.name), ...outcomeCases(baselineOutcomes, `${study.name}.baseline`)].map((c) => ({
              ...c,
              time: seconds / Math.max(1, all.length),
            })),
          });
        }
        if (opts.junit) writeFileAtomic(opts.junit, junitXml(suites));
        if (failures > 0) throw new ExitError(EXIT.checkFailed, `${failures} check${failures === 1 ? '' : 's'} failed`);
      } finally {
        await closeStore(store);
      }
    });
}
