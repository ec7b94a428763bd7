/** The longest `notes` a plan file may carry (PlanSchema: notes max 20 000 characters). */
import { PlanSchema } from '../../../core/plan/schema.ts';

const notesSchema = PlanSchema.shape.notes.unwrap();
export const NOTES_MAX_CHARS: number = notesSchema.maxLength ?? 20_000;
