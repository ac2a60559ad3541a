/** Small pieces the registry's pages share: a list of named figures, the offered badge, the link style. */
import { Badge, cx } from "~/components/ui";

export const linkClass = "font-medium text-ember-800 underline-offset-2 hover:underline";

/** Named figures ("Latitude", "−31.4°") as a definition list; a wide figure takes two columns. */
export function FactList({
  facts,
  className,
  itemClassName,
  valueClassName,
  label,
}: {
  facts: [label: string, value: string, wide?: boolean][];
  className: string;
  itemClassName?: string;
  valueClassName: string;
  label?: string;
}) {
  return (
    <dl className={className} aria-label={label}>
      {facts.map(([name, value, wide]) => (
        <div key={name} className={cx(itemClassName, wide && "col-span-2") || undefined}>
          <dt className="text-sm text-night-600">{name}</dt>
          <dd className={cx("num", valueClassName)}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** Whether proposers may ask for a configuration. */
export function OfferedBadge({ offered }: { offered: boolean }) {
  return offered ? <Badge tone="ok">offered</Badge> : <Badge>not offered</Badge>;
}
