/** The band editor, one component for the new and the edit page; wavelengths in micrometres. */
import { metresToMicrons } from "~/services/registry/schemas";
import type { Route as EditRoute } from "../bands/+types/edit";
import type { Route as NewRoute } from "../bands/+types/new";
import * as Editor from "./EditorPage";
import { BAND_FIELDS } from "./fields";
import { instrumentHref } from "./links";

export const newBandMeta = () => Editor.meta("New band");
export const editBandMeta = ({ data }: EditRoute.MetaArgs) => Editor.meta(`Edit band ${data?.band.name ?? ""}`);

type Props = Editor.Props<NewRoute.ComponentProps, EditRoute.ComponentProps>;

export function BandEditor({ loaderData, actionData }: Props) {
  const { instrument } = loaderData;
  const band = "band" in loaderData ? loaderData.band : null;
  const defaults: Editor.Defaults = band
    ? {
        ...Editor.defaultsOf(band, BAND_FIELDS),
        centralWavelengthUm: String(metresToMicrons(band.centralWavelengthM)),
        bandwidthUm: String(metresToMicrons(band.bandwidthM)),
      }
    : {};
  return (
    <Editor.Page
      noun="band"
      editing={band?.name ?? null}
      title={band ? `Edit band ${band.name} of ${instrument.name}` : `New band of ${instrument.name}`}
      lead={band ? undefined : "Wavelengths in micrometres; they are kept in metres, like every wavelength in the app."}
      state={actionData}
      fields={BAND_FIELDS}
      cancelTo={instrumentHref(instrument.id)}
      below={
        band ? (
          <Editor.DeleteCard title="Delete this band" buttonLabel={`Delete band ${band.name}`}>
            This cannot be undone.
          </Editor.DeleteCard>
        ) : undefined
      }
    >
      <div className="grid max-w-xl gap-4 sm:grid-cols-2">
        <Editor.FieldList specs={BAND_FIELDS} state={actionData} defaults={defaults} />
      </div>
    </Editor.Page>
  );
}
