/** The band editor, one component for the new and the edit page; wavelengths in micrometres. */
import { metresToMicrons } from "~/services/registry/schemas";
import type { Route as EditRoute } from "../bands/+types/edit";
import type { Route as NewRoute } from "../bands/+types/new";
import { type Defaults, DeleteCard, EditorPage, FieldList, registryTitle } from "./EditorPage";
import type { EditorState } from "./editor.server";
import { BAND_FIELDS } from "./fields";
import { instrumentHref } from "./links";

export const newBandMeta = () => registryTitle("New band");
export const editBandMeta = ({ data }: EditRoute.MetaArgs) => registryTitle(`Edit band ${data?.band.name ?? ""}`);

type Props = {
  loaderData: NewRoute.ComponentProps["loaderData"] | EditRoute.ComponentProps["loaderData"];
  actionData?: EditorState;
};

export function BandEditor({ loaderData, actionData }: Props) {
  const { instrument } = loaderData;
  const band = "band" in loaderData ? loaderData.band : null;
  const defaults: Defaults = band
    ? {
        name: band.name,
        centralWavelengthUm: String(metresToMicrons(band.centralWavelengthM)),
        bandwidthUm: String(metresToMicrons(band.bandwidthM)),
        channels: String(band.channels),
        limitingMagnitude: String(band.limitingMagnitude),
      }
    : {};
  return (
    <EditorPage
      title={band ? `Edit band ${band.name} of ${instrument.name}` : `New band of ${instrument.name}`}
      lead={band ? undefined : "Wavelengths in micrometres; they are kept in metres, like every wavelength in the app."}
      state={actionData}
      fields={BAND_FIELDS}
      submitLabel={band ? "Save band" : "Add band"}
      cancelTo={instrumentHref(instrument.id)}
      ariaLabel={band ? `Edit band ${band.name}` : "New band"}
      below={
        band ? (
          <DeleteCard title="Delete this band" buttonLabel={`Delete band ${band.name}`}>
            This cannot be undone.
          </DeleteCard>
        ) : undefined
      }
    >
      <div className="grid max-w-xl gap-4 sm:grid-cols-2">
        <FieldList specs={BAND_FIELDS} state={actionData} defaults={defaults} />
      </div>
    </EditorPage>
  );
}
