import { href, Link } from "react-router";
import { Badge, type BadgeTone, cardClass, cx } from "~/components/ui";
import type { CalendarNight } from "~/services/nights/calendar.server";
import { configurationColour, type Offer } from "./OffersTable";

export const STATE_TONE: Record<CalendarNight["planState"], BadgeTone> = {
  none: "neutral",
  draft: "caution",
  published: "info",
  executed: "ok",
};
export const STATE_WORDS: Record<CalendarNight["planState"], string> = {
  none: "no plan",
  draft: "draft",
  published: "published",
  executed: "executed",
};

const WEEKDAYS = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];
const MONTHS = [
  "January",
  "February",
  "March",
  "April",
  "May",
  "June",
  "July",
  "August",
  "September",
  "October",
  "November",
  "December",
];

/**
 * A small drawing of the Moon's phase as the site sees it: from the northern hemisphere the lit part is on
 * the right while waxing, from the southern on the left.
 */
export function MoonGlyph({ fraction, waxing, south }: { fraction: number; waxing: boolean; south: boolean }) {
  const rx = Math.abs(1 - 2 * fraction) * 6;
  const litRight = waxing !== south;
  const sweepOuter = litRight ? 1 : 0;
  const sweepInner = fraction > 0.5 ? (litRight ? 1 : 0) : litRight ? 0 : 1;
  const d = `M7 1 A6 6 0 0 ${sweepOuter} 7 13 A${rx.toFixed(2)} 6 0 0 ${sweepInner} 7 1 Z`;
  return (
    <svg viewBox="0 0 14 14" className="h-3.5 w-3.5 shrink-0" aria-hidden="true">
      <circle cx="7" cy="7" r="6" fill="#222a3e" />
      <path d={d} fill="#f4f6fa" />
    </svg>
  );
}

function monthsOf(nights: CalendarNight[]) {
  const groups: { key: string; label: string; nights: CalendarNight[] }[] = [];
  for (const n of nights) {
    const key = n.date.slice(0, 7);
    let g = groups[groups.length - 1];
    if (!g || g.key !== key) {
      g = { key, label: `${MONTHS[Number(key.slice(5, 7)) - 1]} ${key.slice(0, 4)}`, nights: [] };
      groups.push(g);
    }
    g.nights.push(n);
  }
  return groups;
}

const weekdayIndex = (date: string) => (new Date(`${date}T00:00:00Z`).getUTCDay() + 6) % 7;

/** The observing period month by month: per night the configuration, dark hours, the Moon and the plan's state. */
export function NightsCalendar({
  calendar,
  today,
}: {
  calendar: {
    offers: Offer[];
    nights: CalendarNight[];
    cycle: { name: string };
    site: { latitudeDeg: number } | null;
  };
  today: string;
}) {
  const south = (calendar.site?.latitudeDeg ?? 0) < 0;
  const colourOf = new Map(calendar.offers.map((o, i) => [o.configurationId, configurationColour(i)]));
  return (
    <section aria-labelledby="calendar-heading" className="grid grid-cols-1 gap-6">
      <h2 id="calendar-heading" className="text-xl font-semibold">
        Nights of {calendar.cycle.name}
      </h2>
      {monthsOf(calendar.nights).map((m) => (
        <section key={m.key} aria-label={m.label} className={cardClass("p-4")}>
          <h3 className="mb-3 font-semibold">{m.label}</h3>
          <div className="hidden grid-cols-7 gap-1 text-center text-xs font-medium text-night-600 md:grid">
            {WEEKDAYS.map((d) => (
              <div key={d}>{d}</div>
            ))}
          </div>
          <ol className="mt-1 grid grid-cols-1 gap-1 sm:grid-cols-2 md:grid-cols-7">
            {Array.from({ length: weekdayIndex(m.nights[0].date) }, (_, i) => (
              <li key={`pad-${i}`} aria-hidden="true" className="hidden md:block" />
            ))}
            {m.nights.map((n) => {
              const colour = n.configurationId ? colourOf.get(n.configurationId) : undefined;
              return (
                <li key={n.date}>
                  <Link
                    to={href("/nights/:date", { date: n.date })}
                    aria-label={`Night of ${n.date}: ${n.configurationName ?? "no configuration"}, ${n.darkHours} h dark, Moon ${Math.round(n.moonFraction * 100)} % lit, ${STATE_WORDS[n.planState]}`}
                    className={cx(
                      "flex h-full flex-col gap-0.5 rounded-md border border-night-200 bg-white p-1.5 text-xs hover:bg-night-50",
                      n.date === today && "ring-2 ring-ember-500",
                    )}
                    style={{ borderLeft: `4px solid ${colour ?? "#cdd4e3"}` }}
                  >
                    <span className="flex items-center justify-between gap-1 font-semibold text-night-900">
                      <span>
                        <span className="md:hidden">{WEEKDAYS[weekdayIndex(n.date)]} </span>
                        {Number(n.date.slice(8, 10))}
                      </span>
                      <MoonGlyph fraction={n.moonFraction} waxing={n.waxing} south={south} />
                    </span>
                    <span className="truncate text-night-700">{n.configurationName ?? "—"}</span>
                    <span className="num text-night-600">
                      {n.darkHours.toFixed(1)} h dark · {Math.round(n.moonFraction * 100)} %
                    </span>
                    {n.planState !== "none" ? (
                      <span>
                        <Badge tone={STATE_TONE[n.planState]}>{STATE_WORDS[n.planState]}</Badge>
                      </span>
                    ) : null}
                  </Link>
                </li>
              );
            })}
          </ol>
        </section>
      ))}
    </section>
  );
}
