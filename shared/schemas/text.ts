/**
 * Free text typed by people: PostgreSQL cannot store a NUL character in text or jsonb, and no
 * person means one, so every free-text field refuses it with a clear message rather than failing
 * in the database.
 */

/** The message for a text that holds a NUL character. */
export const NUL_MESSAGE = 'Remove the invisible control character (NUL) from this text';

/** True when the text holds no NUL character (a zod refine predicate). */
export function hasNoNul(text: string): boolean {
  return !text.includes('\u0000');
}
