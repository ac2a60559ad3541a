/** The instrument editor, one component for the new and the edit page; the edit page lists the bands. */
import { href, Link } from "react-router";
import { ButtonLink, Card, type Column, DataTable, EmptyState } from "~/components/ui";
import { metresToMicrons } from "~/services/registry/schemas";
import type { Route as EditRoute } from "../instruments/+types/edit";
import type { Route as NewRoute } from "../instruments/+types/new";
import { DeleteCard, defaultsOf, EditorPage, FieldList, NoSiteYet, registryTitle } from "./EditorPage";
import type { EditorState } from "./editor.server";
import { INSTRUMENT_FIELDS } from "./fields";
import { overviewHref } from "./links";

export const newInstrumentMeta = () => registryTitle("New instrument");
export const editInstrumentMeta = ({ data }: EditRoute.MetaArgs) =>
  registryTitle(`Edit ${data?.instrument.name ?? "instrument"}`);

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
  {
    key: "wavelength",
    header: "Central wavelength",
    unit: "µm",
    align: "right",
    value: (b) => metresToMicrons(b.centralWavelengthM),
  },
  { key: "bandwidth", header: "Bandwidth", unit: "µm", align: "right", value: (b) => metresToMicrons(b.bandwidthM) },
  { key: "channels", header: "Channels", align: "right", value: (b) => b.channels },
  { key: "limit", header: "Limiting magnitude", unit: "mag", align: "right", value: (b) => b.limitingMagnitude },
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
        <DataTable
          caption={`Bands of ${instrument.name}`}
          columns={bandColumns}
          rows={instrument.bands}
          rowKey={(b) => b.id}
        />
      )}
    </Card>
  );
}

type Props = { loaderData: NewRoute.ComponentProps["loaderData"] | EditData; actionData?: EditorState };

export function InstrumentEditor({ loaderData, actionData }: Props) {
  if (!("instrument" in loaderData)) {
    const { site } = loaderData;
    if (!site) return <NoSiteYet title="New instrument">Instruments belong to a site.</NoSiteYet>;
    return (
      <EditorPage
        title="New instrument"
        lead={`A beam combiner at ${site.name}. Its bands come next.`}
        state={actionData}
        fields={INSTRUMENT_FIELDS}
        submitLabel="Add instrument"
        cancelTo={overviewHref(site.id)}
        ariaLabel="New instrument"
      >
        <input type="hidden" name="siteId" value={site.id} />
        <div className="grid max-w-xl gap-4">
          <FieldList specs={INSTRUMENT_FIELDS} state={actionData} defaults={{}} />
        </div>
      </EditorPage>
    );
  }
  const { instrument, largest } = loaderData;
  const bandCount = instrument.bands.length;
  const below = (
    <>
      <BandsCard instrument={instrument} />
      <DeleteCard title="Delete this instrument" buttonLabel={`Delete ${instrument.name}`}>
        Its {bandCount} band{bandCount === 1 ? "" : "s"} go with it. This cannot be undone.
      </DeleteCard>
    </>
  );
  return (
    <EditorPage
      title={`Edit instrument ${instrument.name}`}
      lead={`A beam combiner at ${loaderData.siteName}.`}
      state={actionData}
      fields={INSTRUMENT_FIELDS}
      submitLabel="Save instrument"
      cancelTo={overviewHref(instrument.siteId)}
      ariaLabel={`Edit instrument ${instrument.name}`}
      below={below}
    >
      <div className="grid max-w-xl gap-4">
        <FieldList specs={INSTRUMENT_FIELDS} state={actionData} defaults={defaultsOf(instrument, INSTRUMENT_FIELDS)} />
      </div>
      {largest && largest.size > instrument.maxTelescopes ? (
        <p className="text-sm font-medium text-caution-700">
          The largest configuration, {largest.name}, has {largest.size} stations: more than this instrument combines.
        </p>
      ) : null}
    </EditorPage>
  );
}
