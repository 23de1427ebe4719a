// PostgreSQL's text and jsonb cannot hold the NUL character (U+0000): the database refuses the whole
// statement. Text fields refuse it here instead, with a message on the field, so a stray NUL is a
// 422 (or a form error) rather than a 500. No keyboard types one; it comes from pasted binary or
// from a script.

export const NUL_FREE = /^[^\u0000]*$/;

export const NUL_ERROR = { error: "Remove the invisible NUL character (U+0000) from this text." } as const;
