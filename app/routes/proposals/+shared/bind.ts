/** A form field's name, the value it shows (what was typed, or what is stored) and its error. */
export function bind(
  name: string,
  values: Record<string, string | undefined>,
  errors: Record<string, string | undefined>,
) {
  return { name, defaultValue: values[name] ?? "", error: errors[name] };
}
