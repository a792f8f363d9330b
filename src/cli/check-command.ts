/** `jostle check`: the built-in validation cases, side by side with their sources; exit 1 on any failure. */
import { checkCases } from '../checks/cases.js';
import type { CheckLine } from '../checks/case.js';
import { JUDGE_LEVEL, runCheckCase } from '../checks/runner.js';
import { significant, withInterval } from '../report/numbers.js';
import { EXIT_FAILED, EXIT_OK, UserFacingError, EXIT_USAGE } from './exit.js';

function render(line: CheckLine): string {
  const sim = withInterval(line.simulated.mean, line.simulated.half_width);
  const expected = typeof line.expected === 'number' ? significant(line.expected, 6) : `[${line.expected[0]}, ${line.expected[1]}]`;
  const simulated = `${sim.mean}${sim.halfWidth === '' ? '' : ` ± ${sim.halfWidth}`}`;
  return `  ${line.verdict === 'pass' ? 'pass' : 'FAIL'}  ${line.metric.padEnd(30)} ${simulated.padStart(22)}   expected ${expected.padEnd(12)} ${line.source}`;
}

export function checkCommand(o: { only: readonly string[]; list: boolean }): number {
  const selected = checkCases.filter((c) => o.only.length === 0 || o.only.some((prefix) => c.id.startsWith(prefix)));
  const unmatched = o.only.filter((prefix) => !checkCases.some((c) => c.id.startsWith(prefix)));
  if (unmatched.length > 0) {
    throw new UserFacingError(`no check case matches ${unmatched.join(', ')}; cases: ${checkCases.map((c) => c.id).join(', ')}`, EXIT_USAGE);
  }
  if (o.list) {
    const width = Math.max(...selected.map((c) => c.id.length));
    for (const c of selected) process.stdout.write(`${c.id.padEnd(width)}  ${c.title}\n`);
    return EXIT_OK;
  }
  process.stdout.write(
    `Simulated value ± 95 % half-width, against closed forms and published values.\nExact values pass when within the ${JUDGE_LEVEL * 100} % interval; values from memory pass inside their band.\n\n`,
  );
  let failures = 0;
  for (const c of selected) {
    process.stdout.write(`${c.id} — ${c.title}\n`);
    for (const line of runCheckCase(c)) {
      if (line.verdict === 'fail') failures++;
      process.stdout.write(`${render(line)}\n`);
    }
  }
  process.stdout.write(failures === 0 ? '\nall checks passed\n' : `\n${failures} check(s) FAILED\n`);
  return failures === 0 ? EXIT_OK : EXIT_FAILED;
}
