// A labelled select of a GET filter form (its value lives in the URL); "any" is the empty value.
import { inputClass } from "./field";

export function FilterSelect({
  name,
  label,
  value,
  any,
  options,
}: {
  name: string;
  label: string;
  value: string | undefined;
  any?: string;
  options: readonly (readonly [string, string])[];
}) {
  return (
    <label className="space-y-1">
      <span className="block text-sm font-semibold">{label}</span>
      <select name={name} defaultValue={value ?? ""} className={inputClass}>
        {any !== undefined ? <option value="">{any}</option> : null}
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
    </label>
  );
}
