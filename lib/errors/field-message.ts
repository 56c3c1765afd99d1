/**
 * "field: message" without saying the field twice. Many messages already begin with their field
 * ("data: at most 200 measurements", "endTimeS must be above 0"); prefixing those again gave
 * "data: data: …". Pure: used by the route glue, the child processes and the command line.
 */

/** True when `message` begins with `field` as a whole word ("data:", "data must", "data[0]…"). */
export function startsWithField(message: string, field: string): boolean {
  if (field === "" || !message.startsWith(field)) return false;
  const next = message.charAt(field.length);
  return next === "" || /[\s:.([]/.test(next);
}

/** `field: message`, unless the message already names the field first. */
export function prefixField(field: string | undefined | null, message: string): string {
  if (!field) return message;
  return startsWithField(message, field) ? message : `${field}: ${message}`;
}
