/** The options of a select: "— choose —" for none, then one per item (`disabled` ones shown but not choosable). */
export function Choices({ items }: { items: { value: string | number; label: string; disabled?: boolean }[] }) {
  return (
    <>
      <option value="">— choose —</option>
      {items.map((item) => (
        <option key={item.value} value={item.value} disabled={item.disabled}>
          {item.label}
        </option>
      ))}
    </>
  );
}
