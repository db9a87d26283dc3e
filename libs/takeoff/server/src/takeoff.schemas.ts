import { z } from 'zod';
import { DEFAULT_RATES, LIMITS, type TakeoffRates } from '@latchwork/takeoff';

// The shape of a takeoff request. Geometry rules (crossing walls, obstacles outside the
// floor, doorways off an edge) are the engine's own validateTakeoffInput; zod checks types.
const point = z.tuple([z.number().finite(), z.number().finite()]);
// A generous cap against abuse; the engine itself names the 5,000-vertex limit.
const polygon = z.array(point).max(LIMITS.maxVertices * 4);

/** Every rate is a non-negative number except the anchoring method. */
export const rateOverrides = z
  .object(
    Object.fromEntries(
      (Object.keys(DEFAULT_RATES) as (keyof TakeoffRates)[]).map((key) => [
        key,
        key === 'anchoring'
          ? z.enum(['tape', 'mastic']).optional()
          : z.number().finite().min(0).optional(),
      ]),
    ) as Record<keyof TakeoffRates, z.ZodOptional<z.ZodNumber>>,
  )
  .strict();

const colour = z.string().trim().min(1).max(40);

export const takeoffInput = z.object({
  outline: polygon,
  obstacles: z.array(polygon).max(2000).optional(),
  doorways: z
    .array(z.object({ from: point, to: point, ramp: z.boolean().optional() }))
    .max(200)
    .optional(),
  tile: z.object({ pitchMm: z.number().finite() }),
  gapMm: z.number().finite().optional(),
  origin: z
    .union([
      z.enum(['auto', 'centre']),
      z.object({ x: z.number().finite(), y: z.number().finite() }),
    ])
    .optional(),
  layoutAngleDeg: z.number().finite().optional(),
  overagePct: z.number().finite().min(0).max(100).optional(),
  packSize: z.number().int().min(1).max(10_000).optional(),
  minCutMm: z.number().finite().min(0).optional(),
  pattern: z
    .discriminatedUnion('kind', [
      z.object({ kind: z.literal('single'), colour: colour.optional() }),
      z.object({ kind: z.literal('chequer'), colours: z.tuple([colour, colour]) }),
      z.object({
        kind: z.literal('stripes'),
        colours: z.array(colour).min(1).max(12),
        widthTiles: z.number().int().min(1).max(1000).optional(),
        direction: z.enum(['rows', 'columns']).optional(),
      }),
      z.object({
        kind: z.literal('border'),
        rows: z.number().int().min(1).max(100),
        borderColour: colour,
        fieldColour: colour,
      }),
      z.object({
        kind: z.literal('bays'),
        baseColour: colour,
        bays: z.array(z.object({ polygon, colour })).max(200),
      }),
    ])
    .optional(),
  zones: z
    .object({
      adhesive: z.array(polygon).max(500).optional(),
      levelling: z
        .array(z.object({ polygon, depthMm: z.number().finite() }))
        .max(500)
        .optional(),
    })
    .optional(),
  rates: rateOverrides.optional(),
  skirtObstacles: z.boolean().optional(),
  suggestOrigin: z.boolean().optional(),
});
