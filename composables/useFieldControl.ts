/** The props every labelled control shares (FormTextField, FormTextArea, FormSelect). */
export interface FieldControlProps {
  label: string
  name?: string
  error?: string
  hint?: string
  id?: string
  labelClass?: string
  /** Extra classes for the control itself (e.g. a compact filter), beside `field`. */
  controlClass?: string
}

/**
 * For a field component with `inheritAttrs: false`: `wrapper()` is what its FormField takes (the label, hint and
 * error, plus the caller's `class`/`style` for layout); `control(field)` is what its control takes: every other
 * attribute (`maxlength`, `min`, `inputmode`, `data-testid`…), the name, and FormField's id and aria attributes.
 * Functions, not computeds: attrs are not reactive, but the template re-renders when they change.
 */
export function useFieldControl(props: FieldControlProps) {
  const attrs = useAttrs()
  return {
    wrapper: () => ({ class: attrs.class, style: attrs.style, label: props.label, error: props.error, hint: props.hint, id: props.id, labelClass: props.labelClass }),
    control: (field: Record<string, unknown>) => ({
      ...Object.fromEntries(Object.entries(attrs).filter(([key]) => key !== 'class' && key !== 'style')),
      name: props.name,
      class: props.controlClass,
      ...field,
    }),
  }
}
