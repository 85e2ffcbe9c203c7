/**
 * The forms behind a course outcome, checked with zod at the boundary (pure, browser-safe): the
 * cohort's theory pass mark, a trainee's theory result, the cohort's observation checklist and one
 * tick of it.
 */
import { z } from 'zod';
import { parseNumberText } from '../format/parse-number';
import { isoDateSchema } from '../validation/iso-date';

const typedNumber = (v: unknown) => (typeof v === 'string' ? parseNumberText(v) : v);

export const passMarkSchema = z.object({
  passMark: z.preprocess(
    typedNumber,
    z.number({ error: 'Enter the pass mark in percent.' }).int('Enter a whole percent.').min(1, 'At least 1 %.').max(100, 'At most 100 %.'),
  ),
});

export const theoryResultSchema = z.object({
  score: z.preprocess(
    typedNumber,
    z
      .number({ error: 'Enter the score in percent.' })
      .min(0, 'At least 0 %.')
      .max(100, 'At most 100 %.')
      .refine((v) => Math.abs(v * 10 - Math.round(v * 10)) < 1e-9, 'At most one decimal (e.g. 72.5).'),
  ),
  takenOn: isoDateSchema('Enter the day of the theory test, e.g. 2026-03-31.'),
});

const labelSchema = z.string().trim().transform((v) => v.replace(/\s+/g, ' ')).pipe(z.string().min(3, 'An item needs at least 3 characters.').max(120, 'Keep an item under 120 characters.'));

export const MAX_CHECKLIST_ITEMS = 20;

export const checklistSchema = z
  .object({
    items: z.array(z.object({ id: z.number().int().positive(), label: labelSchema, retire: z.boolean() })).max(50),
    added: z.array(labelSchema).max(MAX_CHECKLIST_ITEMS),
  })
  .refine((v) => v.items.some((i) => !i.retire) || v.added.length > 0, { message: 'Keep at least one item.', path: ['items'] })
  .refine((v) => v.items.filter((i) => !i.retire).length + v.added.length <= MAX_CHECKLIST_ITEMS, { message: `At most ${MAX_CHECKLIST_ITEMS} items.`, path: ['items'] });

export type ChecklistInput = z.infer<typeof checklistSchema>;

export const tickSchema = z.object({
  itemId: z.coerce.number().int().positive(),
  observed: z.boolean(),
  note: z.string().trim().max(400, 'Keep the note under 400 characters.').transform((v) => (v === '' ? null : v)),
});

export const overrideReasonSchema = z.string().trim().min(3, 'Give a reason of at least 3 characters.').max(400, 'At most 400 characters.');
