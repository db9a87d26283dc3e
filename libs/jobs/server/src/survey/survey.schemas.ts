import { z } from 'zod';
import { READING_KINDS, READING_METHODS } from '@latchwork/jobs-domain';

/** Substrates the survey records; the migration's check constraint lists the same. */
export const SUBSTRATES = ['concrete', 'screed', 'asphalt', 'timber', 'existing_floor'] as const;

export const jobParams = z.object({ jobId: z.uuid() });
export const areaParams = jobParams.extend({ areaId: z.uuid() });
export const versionParams = areaParams.extend({
  takeoffVersion: z.coerce.number().int().min(1).max(1_000_000),
});
export const readingParams = jobParams.extend({ readingId: z.uuid() });

/** The survey's details; every field replaces what was there (a form saves them together). */
export const surveyDetails = z.object({
  substrate: z.enum(SUBSTRATES).nullable(),
  surveyedAt: z.iso.datetime({ offset: true }).nullable(),
  surveyorUserId: z.uuid().nullable(),
  notes: z.string().max(10_000),
});

export const areaBody = z.object({ name: z.string().trim().min(1).max(120) });

const ALL_METHODS = Object.values(READING_METHODS).flat() as [string, ...string[]];

/**
 * A slab reading. Whether the method fits the kind and the value is plausible is the domain's
 * `readingProblems`, reported as 400 with the same sentences the form shows.
 */
export const readingBody = z.object({
  kind: z.enum(READING_KINDS as [string, ...string[]]),
  method: z.enum(ALL_METHODS),
  value: z.number().finite(),
  unit: z.enum(['lb_per_1000ft2_24h', 'g_per_m2_24h']).optional(),
  location: z.string().trim().max(200).default(''),
  takenAt: z.iso.datetime({ offset: true }),
});

const limitOverride = z
  .object({
    value: z.number().finite().min(-40).max(1000).optional(),
    warnMargin: z.number().finite().min(0).max(1000).optional(),
    source: z.string().trim().min(1).max(200).optional(),
  })
  .strict();

/** A firm's overrides by reading kind; a kind left out uses the default. */
export const limitOverrides = z
  .object(
    Object.fromEntries(READING_KINDS.map((kind) => [kind, limitOverride.optional()])) as Record<
      (typeof READING_KINDS)[number],
      z.ZodOptional<typeof limitOverride>
    >,
  )
  .strict();
export type LimitOverrides = z.output<typeof limitOverrides>;
