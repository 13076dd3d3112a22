/**
 * An experimental design: the choice tasks respondents answer, grouped into blocks.
 * Each designed alternative gives one level id per attribute; the opt-out / status quo
 * alternative is not stored here (it is fixed by the study definition).
 */
import { z } from 'zod';
import { elementIdSchema } from './study-definition';

export const designAlternativeSchema = z.object({
  /** attribute id -> level id; attributes omitted for a labeled alternative are absent. */
  levels: z.record(z.string(), elementIdSchema),
});

export const designTaskSchema = z.object({
  /** 1-based block number. */
  block: z.number().int().min(1),
  /** 1-based task number, unique across the design. */
  task: z.number().int().min(1),
  alternatives: z.array(designAlternativeSchema).min(2).max(5),
});
export type DesignTask = z.infer<typeof designTaskSchema>;

/** Most tasks a design holds (imported studies store each distinct choice set as one). */
export const DESIGN_MAX_TASKS = 2000;

export const designSchema = z.object({
  blocks: z.number().int().min(1).max(50),
  tasks: z.array(designTaskSchema).min(1).max(DESIGN_MAX_TASKS),
});
export type Design = z.infer<typeof designSchema>;
