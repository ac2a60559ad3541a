/** The site editor, one component for the new and the edit page. */
import { TextField } from "~/components/ui";
import { sentence } from "~/lib/form-errors";
import type { Route as EditRoute } from "../sites/+types/edit";
import type { Route as NewRoute } from "../sites/+types/new";
import * as Editor from "./EditorPage";
import { SITE_FIELDS } from "./fields";
import { overviewHref } from "./links";

export const newSiteMeta = () => Editor.meta("New site");
export const editSiteMeta = ({ data }: EditRoute.MetaArgs) => Editor.meta(`Edit ${data?.site.name ?? "site"}`);

type Data = EditRoute.ComponentProps["loaderData"];

function SiteFields({
  state,
  defaults,
  timeZones,
}: {
  state: Editor.FormState;
  defaults: Editor.Defaults;
  timeZones: string[];
}) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <Editor.FieldList specs={SITE_FIELDS} state={state} defaults={defaults} />
      <datalist id="registry-time-zones">
        {timeZones.map((z) => (
          <option key={z} value={z} />
        ))}
      </datalist>
    </div>
  );
}

/** Deleting a site takes everything at it: its name must be typed to confirm. */
function DeleteSiteCard({ site, contents, state }: Pick<Data, "site" | "contents"> & { state: Editor.FormState }) {
  const confirmError = state?.errors?.confirmName;
  const confirmField = (
    <div className="max-w-sm">
      <TextField
        label="Type the site's name to confirm"
        name="confirmName"
        autoComplete="off"
        defaultValue={confirmError ? (state?.values?.confirmName ?? "") : ""}
        error={confirmError ? sentence(confirmError) : undefined}
      />
    </div>
  );
  return (
    <Editor.DeleteCard title="Delete this site" buttonLabel="Delete site" fields={confirmField}>
      Deleting {site.name} also deletes its {contents.stations} stations, {contents.configurations} configurations and{" "}
      {contents.instruments} instruments with their bands. This cannot be undone; export the registry first if you may
      want it back.
    </Editor.DeleteCard>
  );
}

type Props = Editor.Props<NewRoute.ComponentProps, EditRoute.ComponentProps>;

export function SiteEditor({ loaderData, actionData }: Props) {
  const edit = "site" in loaderData ? loaderData : null;
  const site = edit?.site ?? null;
  // A refused delete answers on the confirmation field; the save form keeps its defaults.
  const state = actionData?.errors.confirmName ? null : actionData;
  return (
    <Editor.Page
      noun="site"
      editing={site?.name ?? null}
      label={site ? `Edit ${site.name}` : undefined}
      lead={
        site
          ? "Changes apply at once to every sketch and feasibility check that uses the site."
          : "The place the array stands: its position, the lowest elevation it observes at and its delay-line stroke."
      }
      state={state}
      fields={SITE_FIELDS}
      cancelTo={overviewHref(site?.id)}
      below={edit ? <DeleteSiteCard site={edit.site} contents={edit.contents} state={actionData} /> : undefined}
    >
      <SiteFields
        state={state}
        defaults={site ? Editor.defaultsOf(site, SITE_FIELDS) : { minElevationDeg: "30", timeZone: "UTC" }}
        timeZones={loaderData.timeZones}
      />
    </Editor.Page>
  );
}
