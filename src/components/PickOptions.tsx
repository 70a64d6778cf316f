/**
 * The choices of a <select>: plain options first, then grouped ones under their headings
 * (as the cover lists are grouped by what a person sees on the pipe). Shared by the estimate
 * form and the site-walk form.
 */
export interface PickOption {
  readonly value: string;
  readonly label: string;
}

export interface PickGroup {
  readonly label: string;
  readonly options: readonly PickOption[];
}

export function PickOptions({ options, groups = [] }: { options: readonly PickOption[]; groups?: readonly PickGroup[] }) {
  return (
    <>
      {options.map((option) => (
        <option key={option.value} value={option.value}>
          {option.label}
        </option>
      ))}
      {groups.map((group) => (
        <optgroup key={group.label} label={group.label}>
          {group.options.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </optgroup>
      ))}
    </>
  );
}
