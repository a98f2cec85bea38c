/** The `<option>`s of a select over a fixed list of values, each with its label. */
export function ChoiceOptions<T extends string>({ values, labels }: { values: readonly T[]; labels: Record<T, string> }) {
  return values.map((value) => (
    <option key={value} value={value}>
      {labels[value]}
    </option>
  ));
}
