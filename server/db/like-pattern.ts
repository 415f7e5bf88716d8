// What someone types into a filter box, as a LIKE pattern: its own wildcards (`%`, `_`) and the escape character are
// taken literally, so "KFD_B" finds "KFD_B", not "KFD-B", and "%" finds a percent sign, not everything.
const literal = (text: string) => text.replace(/[\\%_]/g, '\\$&');

/** The values that start with `text`. */
export const likePrefix = (text: string) => `${literal(text)}%`;

/** The values that hold `text` anywhere. */
export const likeContaining = (text: string) => `%${literal(text)}%`;
