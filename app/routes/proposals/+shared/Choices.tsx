/** The options of a select: "— choose —" for none, then one per item. */
export function Choices({ items }: { items: { value: string | number; label: string }[] }) {
  return (
    <>
      <option value="">— choose —</option>
      {items.map((item) => (
        <option key={item.value} value={item.value}>
          {item.label}
        </option>
      ))}
    </>
  );
}
