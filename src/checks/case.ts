/**
 * A validation case: an experiment run through the real simulator (config text → loader → cell →
 * statistics) whose metrics are compared with a value from outside the project.
 */
import type { Summary } from '../stats/index.js';

export type Verdict = 'pass' | 'fail';

export interface Expectation {
  /** Metric name as in summary.json. */
  readonly metric: string;
  /** What the metric is compared with (the closed-form or published value). */
  readonly expected: number;
  /**
   * How far the simulated mean may be from the expected value, beyond its own confidence interval:
   * 0 for exact results; a band for published or recalled values.
   */
  readonly tolerance: number;
  /** Where the expected value comes from (document, table, equation), as in reference-values.md. */
  readonly source: string;
  /** Multiply the metric before comparing (e.g. a probability per preamble × M = preambles per occasion). */
  readonly scale?: number;
}

/** A loose band for values recalled from memory: pass when the mean lies inside [low, high]. */
export interface Band {
  readonly metric: string;
  readonly low: number;
  readonly high: number;
  readonly source: string;
}

export interface CheckCase {
  readonly id: string;
  readonly title: string;
  /** The experiment, as YAML text, exactly as a user would write it. */
  readonly yaml: string;
  readonly expectations: readonly Expectation[];
  readonly bands?: readonly Band[];
}

export interface CheckLine {
  readonly caseId: string;
  readonly metric: string;
  readonly simulated: Summary;
  readonly expected: number | readonly [number, number];
  readonly allowed: number;
  readonly source: string;
  readonly verdict: Verdict;
}
