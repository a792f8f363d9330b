/**
 * The experiment file: one schema from which the TypeScript types are inferred, the defaults are
 * filled and the editor JSON Schema is generated. Every key documents its unit and default.
 */
import { z } from 'zod';
import { accessSchema } from '../access/policies/registry.js';
import { randomAccessSchema } from '../access/contention/params.js';
import { conditionsOf, DEFAULT_COMPARE_METRICS, metricDefinition, metricNames } from '../metrics/catalogue.js';
import { trafficModel, trafficSchema } from '../traffic/registry.js';
import { uplinkSchema } from '../access/grants/params.js';
import { energySchema } from '../metrics/energy.js';
import { layoutSchema } from '../geometry/layout.js';
import { duration } from './duration.js';
import { length } from './length.js';
import { sweepSchema } from './sweep-schema.js';

const name = (what: string, allowDot = true) =>
  z
    .string()
    .regex(
      allowDot ? /^[A-Za-z0-9][A-Za-z0-9._-]*$/ : /^[A-Za-z0-9][A-Za-z0-9_-]*$/,
      `${what} may use letters, digits, ${allowDot ? "'.', " : ''}'_' and '-', and must start with a letter or digit`,
    );

export const groupSchema = z
  .strictObject({
    count: z.number().int().positive().describe('Number of devices in the group.'),
    traffic: trafficSchema.describe('When the devices of the group get packets.'),
    access: accessSchema.prefault({ policy: 'contention' }),
    deadline: duration({ positive: true, description: 'Delivery deadline of a packet, counted from its arrival (enables deadline_met_share).' }).optional(),
    layout: layoutSchema
      .prefault({ model: 'uniform-disc' })
      .describe('Where the devices are (used by alarm-field traffic and the neighbour predictor).'),
  })
  .describe('A group of devices sharing traffic model, access policy and deadline.');

const stoppingSchema = z
  .strictObject({
    metric: z.enum(metricNames as [string, ...string[]]).describe('Cell-level metric whose confidence interval decides when to stop.'),
    relative_precision: z
      .number()
      .gt(0)
      .lt(1)
      .describe('γ: stop when half-width / |mean| ≤ γ/(1+γ) (Law & Kelton, relative-precision sequential procedure).'),
    min_replications: z.number().int().min(2).default(5).describe('Replications run before the rule is first applied.'),
    max_replications: z.number().int().min(2).default(1000).describe('Upper bound on replications.'),
  })
  .refine((s) => s.max_replications >= s.min_replications, {
    message: 'max_replications must be at least min_replications',
    path: ['max_replications'],
  })
  .describe('Sequential stopping: add replications until the named metric is precise enough.');

export const experimentSchema = z
  .strictObject({
    experiment: name('experiment name').describe('Name of the experiment; results go to results/<name>/ by default.'),
    description: z.string().optional().describe('Free text shown in reports.'),
    seed: z
      .union([z.number().int().nonnegative(), z.string().min(1)])
      .default(1)
      .describe('Root seed; every random stream is derived from it by hashing.'),
    replications: z
      .number()
      .int()
      .min(1)
      .max(1_000_000)
      .optional()
      .describe('Independent replications per point (default 10; not with `stopping`).'),
    stopping: stoppingSchema.optional(),
    confidence_level: z.number().gt(0.5).lt(1).default(0.95).describe('Two-sided level of the Student-t confidence intervals.'),
    common_random_numbers: z
      .boolean()
      .default(false)
      .describe('When true, replication r of every point uses the same random streams (paired comparisons across points).'),
    horizon: duration({ positive: true, description: 'Simulated time to run; required when any traffic recurs. Without it the run ends when every access is resolved.' }).optional(),
    warmup: duration({ description: 'Packets arriving before this time are simulated but not counted.' }).default(0),
    max_events: z
      .number()
      .int()
      .positive()
      .default(2_000_000_000)
      .describe('Safety limit on kernel events per replication; reaching it is reported as an error.'),
    cell: z
      .strictObject({
        radius: length({ positive: true, description: 'Cell radius (device layouts, alarm epicentres).' }).prefault('500m'),
        random_access: randomAccessSchema.prefault({}),
        uplink: uplinkSchema.prefault({}),
        energy: energySchema.prefault({}),
      })
      .prefault({})
      .describe('The cell: its random-access channel, scheduled uplink resources and device power model.'),
    sweep: sweepSchema.optional(),
    report: z
      .strictObject({
        compare_metrics: z
          .array(z.enum(metricNames as [string, ...string[]]))
          .min(1)
          .default([...DEFAULT_COMPARE_METRICS])
          .describe('Metrics shown side by side when the experiment has several points.'),
        compare_groups: z
          .array(z.string())
          .optional()
          .describe('Groups that get their own comparison table (default: the groups with a deadline).'),
        plot_metrics: z
          .array(z.enum(metricNames as [string, ...string[]]))
          .min(1)
          .optional()
          .describe('Metrics plotted against the swept parameters (default: success, deadline, delay mean and p95, throughput, collisions, wasted grants, energy, age — those reported).'),
      })
      .prefault({})
      .describe('What the terminal report shows (every metric is always in the files).'),
    groups: z
      .record(name('group name', false), groupSchema)
      .refine((groups) => Object.keys(groups).length > 0, { message: 'at least one device group is needed' })
      .describe('Device groups, keyed by name (e.g. `groups.meters.count`).'),
  })
  .superRefine((e, ctx) => {
    if (e.replications !== undefined && e.stopping !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['replications'], message: 'give either `replications` or `stopping`, not both' });
    }
    if (e.horizon === undefined) {
      for (const [group, g] of Object.entries(e.groups)) {
        if (g.access.policy === 'random-grant' || g.access.policy === 'predicted-grant') {
          ctx.addIssue({
            code: 'custom',
            path: ['groups', group, 'access', 'policy'],
            message: `'${g.access.policy}' hands out grants at every occasion without end, so the experiment needs a \`horizon\` (e.g. horizon: 10min)`,
          });
        }
        if (trafficModel(g.traffic.model).recurring(g.traffic)) {
          ctx.addIssue({
            code: 'custom',
            path: ['groups', group, 'traffic', 'model'],
            message: `traffic model '${g.traffic.model}' never stops sending, so the experiment needs a \`horizon\` (e.g. horizon: 1h)`,
          });
        }
      }
    } else if (e.warmup >= e.horizon) {
      ctx.addIssue({ code: 'custom', path: ['warmup'], message: 'warmup must be shorter than horizon' });
    }
    checkConfiguredGrants(e, ctx);
    if (e.stopping !== undefined) {
      const when = metricDefinition(e.stopping.metric)?.when;
      if (when !== undefined && !when(conditionsOf(e))) {
        ctx.addIssue({
          code: 'custom',
          path: ['stopping', 'metric'],
          message: `'${e.stopping.metric}' is not reported for this experiment (it needs ${conditionText(e.stopping.metric)}), so the stopping rule could never be met`,
        });
      }
    }
    (e.report.compare_groups ?? []).forEach((g, i) => {
      if (!(g in e.groups)) {
        ctx.addIssue({ code: 'custom', path: ['report', 'compare_groups', i], message: `no group named '${g}'; groups: ${Object.keys(e.groups).join(', ')}` });
      }
    });
  })
  .describe('A jostle experiment: a cell, its device groups, and how to replicate.');

/** What a conditional metric needs, in words (for the stopping-rule check). */
function conditionText(metric: string): string {
  const probe = metricDefinition(metric)?.when;
  if (probe === undefined) return 'nothing';
  const none = { barring: false, anyDeadline: false, grants: false, predictors: false, fallback: false, horizon: false };
  const words: Record<keyof typeof none, string> = {
    barring: 'access class barring (cell.random_access.barring)',
    anyDeadline: 'a group with a `deadline`',
    grants: 'a group with a grant policy',
    predictors: 'a group with `policy: predicted-grant`',
    fallback: 'a grant policy with `fallback_after`',
    horizon: 'a `horizon`',
  };
  const needed = (Object.keys(none) as (keyof typeof none)[]).filter((k) => probe({ ...none, [k]: true }));
  return needed.map((k) => words[k]).join(' or ') || 'a condition this experiment does not meet';
}

/** Configured grants reserve capacity: every subframe must hold the reservations of all groups. */
function checkConfiguredGrants(
  e: { cell: { uplink: { capacity: number } }; groups: Record<string, { count: number; access: { policy: string; period?: number } }> },
  ctx: z.RefinementCtx,
): void {
  let reserved = 0;
  const names: string[] = [];
  for (const [name, g] of Object.entries(e.groups)) {
    if (g.access.policy !== 'configured-grant' || g.access.period === undefined) continue;
    reserved += Math.ceil(g.count / g.access.period);
    names.push(name);
  }
  if (reserved > e.cell.uplink.capacity) {
    ctx.addIssue({
      code: 'custom',
      path: ['groups', names[names.length - 1] as string, 'access', 'period'],
      message: `configured grants of ${names.join(', ')} reserve up to ${reserved} transmissions per subframe but cell.uplink.capacity is ${e.cell.uplink.capacity}: lengthen the period(s) or raise the capacity`,
    });
  }
}

export type ExperimentConfig = z.output<typeof experimentSchema>;
export type GroupConfig = z.output<typeof groupSchema>;

/** Default replication count when neither `replications` nor `stopping` is given. */
export const DEFAULT_REPLICATIONS = 10;
