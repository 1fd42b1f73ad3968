/**
 * For a form's className: a select is as wide as its longest option and a fieldset as wide as its content, which on
 * a phone pushes the whole page wider than the screen (instrument and accuracy labels are long). These let them shrink.
 */
export const narrowFields = "[&>*]:min-w-0 [&_fieldset]:min-w-0 [&_fieldset>*]:min-w-0 [&_select]:w-full [&_select]:min-w-0";
