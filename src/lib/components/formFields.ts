// A posted form's field is named once: its name, the value to show again and its error come from
// the form's values and errors under that name (spread into Field or TextAreaField).
type Values = Readonly<Record<string, string | undefined>>;

/** `{...field('phone')}` gives `name="phone"`, the kept or stored value and the field's error. */
export function formFields(values: Values, errors: Values): (name: string) => { name: string; value: string | undefined; error: string | undefined } {
	return (name) => ({ name, value: values[name], error: errors[name] });
}
