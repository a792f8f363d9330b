/** The golden runs (kept small: they run in every `npm test`). */
import { repoFile } from '../cli/run-cli.js';

export const GOLDEN_CASES: ReadonlyArray<{ readonly name: string; readonly args: readonly string[] }> = [
  { name: 'tr37868-model2', args: [repoFile('configs/reference/tr37868-model2.yaml'), '--reps', '3', '--vary', 'groups.mtc.count=3000,30000'] },
  { name: 'tr37868-model1-barring', args: [repoFile('configs/reference/tr37868-model1.yaml'), '--reps', '2', '--set', 'groups.mtc.count=10000', '--set', 'cell.random_access.barring={factor: 0.5, time: 4s, apply_to: every-attempt}'] },
  { name: 'harbour-district', args: [repoFile('configs/demo.yaml'), '--reps', '2', '--set', 'horizon=1min'] },
  { name: 'oracle-break-even', args: [repoFile('configs/break-even/oracle-recall-false-alarm.yaml'), '--reps', '2', '--set', 'horizon=40s', '--vary', 'groups.alarms.access.predictor.recall=0.5,0.9', '--vary', 'cell.uplink.reserved_for_grants=1,5'] },
];
