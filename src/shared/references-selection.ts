import { z } from 'zod';

/** Where in a reference to look for the molecule (1-based atom numbers, as the files number them). */
export const referenceSelection = z.union([
  z.object({ residue: z.string().trim().min(1).max(8) }).strict(),
  z
    .object({
      start: z.number().int().min(1),
      atomsPerCopy: z.number().int().min(1).max(100_000),
      copies: z.number().int().min(1).max(10_000_000),
    })
    .strict(),
]);
export type ReferenceSelection = z.infer<typeof referenceSelection>;
