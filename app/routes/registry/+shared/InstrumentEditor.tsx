/** The instrument editor, one component for the new and the edit page; the edit page lists the bands. */
import { href, Link } from "react-router";
import { ButtonLink, Card, type Column, DataTable, EmptyState } from "~/components/ui";
import { metresToMicrons } from "~/services/registry/schemas";
import type { Route as EditRoute } from "../instruments/+types/edit";
import type { Route as NewRoute } from "../instruments/+types/new";
import { bandColumns as bandFigures } from "./columns";
import * as Editor from "./EditorPage";
import { INSTRUMENT_FIELDS } from "./fields";
import { overviewHref } from "./links";

export const newInstrumentMeta = () => Editor.meta("New instrument");
export const editInstrumentMeta = ({ data }: EditRoute.MetaArgs) =>
  Editor.meta(`Edit ${data?.instrument.name ?? "instrument"}`);

type EditData = EditRoute.ComponentProps["loaderData"];
type BandRow = EditData["instrument"]["bands"][number];

const bandColumns: Column<BandRow>[] = [
  {
    key: "name",
    header: "Band",
    value: (b) => b.name,
    render: (b) => (
      <Link
        to={href("/registry/bands/:bandId/edit", { bandId: String(b.id) })}
        className="font-medium text-ember-800 underline-offset-2 hover:underline"
        aria-label={`Edit band ${b.name}`}
      >
        {b.name}
      </Link>
    ),
  },
  ...bandFigures<BandRow>(metresToMicrons),
];

function BandsCard({ instrument }: { instrument: EditData["instrument"] }) {
  const add = href("/registry/instruments/:instrumentId/bands/new", { instrumentId: String(instrument.id) });
  return (
    <Card
      title="Bands"
      actions={
        <ButtonLink to={add} size="sm">
          Add band
        </ButtonLink>
      }
    >
      {instrument.bands.length === 0 ? (
        <EmptyState title="No bands yet">Proposals pick an instrument band; add at least one.</EmptyState>
      ) : (
        <DataTable caption={`Bands of ${instrument.name}`} columns={bandColumns} rows={instrument.bands} />
      )}
    </Card>
  );
}

type Props = Editor.Props<NewRoute.ComponentProps, EditRoute.ComponentProps>;

export function InstrumentEditor({ loaderData, actionData }: Props) {
  const edit = "instrument" in loaderData ? loaderData : null;
  const site = "site" in loaderData ? loaderData.site : null;
  if (!edit && !site) return <Editor.NoSiteYet title="New instrument">Instruments belong to a site.</Editor.NoSiteYet>;
  const instrument = edit?.instrument ?? null;
  const largest = edit?.largest;
  const below = instrument ? (
    <>
      <BandsCard instrument={instrument} />
      <Editor.DeleteCard title="Delete this instrument" buttonLabel={`Delete ${instrument.name}`}>
        Its {instrument.bands.length} band{instrument.bands.length === 1 ? "" : "s"} go with it. This cannot be undone.
      </Editor.DeleteCard>
    </>
  ) : undefined;
  return (
    <Editor.Page
      noun="instrument"
      editing={instrument?.name ?? null}
      lead={edit ? `A beam combiner at ${edit.siteName}.` : `A beam combiner at ${site?.name}. Its bands come next.`}
      state={actionData}
      fields={INSTRUMENT_FIELDS}
      cancelTo={overviewHref(instrument?.siteId ?? site?.id)}
      below={below}
    >
      {site ? <input type="hidden" name="siteId" value={site.id} /> : null}
      <div className="grid max-w-xl gap-4">
        <Editor.FieldList
          specs={INSTRUMENT_FIELDS}
          state={actionData}
          defaults={instrument ? Editor.defaultsOf(instrument, INSTRUMENT_FIELDS) : {}}
        />
      </div>
      {instrument && largest && largest.size > instrument.maxTelescopes ? (
        <p className="text-sm font-medium text-caution-700">
          The largest configuration, {largest.name}, has {largest.size} stations: more than this instrument combines.
        </p>
      ) : null}
    </Editor.Page>
  );
}
