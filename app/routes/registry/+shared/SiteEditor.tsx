/** The site editor, one component for the new and the edit page. */
import { TextField } from "~/components/ui";
import { sentence } from "~/lib/form-errors";
import type { Route as EditRoute } from "../sites/+types/edit";
import type { Route as NewRoute } from "../sites/+types/new";
import {
  type Defaults,
  DeleteCard,
  defaultsOf,
  EditorPage,
  FieldList,
  type FormState,
  registryTitle,
} from "./EditorPage";
import type { EditorState } from "./editor.server";
import { SITE_FIELDS } from "./fields";
import { overviewHref } from "./links";

export const newSiteMeta = () => registryTitle("New site");
export const editSiteMeta = ({ data }: EditRoute.MetaArgs) => registryTitle(`Edit ${data?.site.name ?? "site"}`);

function SiteFields({ state, defaults, timeZones }: { state: FormState; defaults: Defaults; timeZones: string[] }) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <FieldList specs={SITE_FIELDS} state={state} defaults={defaults} />
      <datalist id="registry-time-zones">
        {timeZones.map((z) => (
          <option key={z} value={z} />
        ))}
      </datalist>
    </div>
  );
}

type Props = {
  loaderData: NewRoute.ComponentProps["loaderData"] | EditRoute.ComponentProps["loaderData"];
  actionData?: EditorState;
};

export function SiteEditor({ loaderData, actionData }: Props) {
  if (!("site" in loaderData)) {
    return (
      <EditorPage
        title="New site"
        lead="The place the array stands: its position, the lowest elevation it observes at and its delay-line stroke."
        state={actionData}
        fields={SITE_FIELDS}
        submitLabel="Add site"
        cancelTo={overviewHref()}
        ariaLabel="New site"
      >
        <SiteFields
          state={actionData}
          defaults={{ minElevationDeg: "30", timeZone: "UTC" }}
          timeZones={loaderData.timeZones}
        />
      </EditorPage>
    );
  }
  const { site, contents } = loaderData;
  const defaults = defaultsOf(site, SITE_FIELDS);
  const confirmError = actionData?.errors.confirmName;
  // A refused delete answers on the confirmation field; the save form keeps its defaults.
  const saveState = confirmError ? null : actionData;
  const deleteCard = (
    <DeleteCard
      title="Delete this site"
      buttonLabel="Delete site"
      fields={
        <div className="max-w-sm">
          <TextField
            label="Type the site's name to confirm"
            name="confirmName"
            autoComplete="off"
            defaultValue={confirmError ? (actionData?.values.confirmName ?? "") : ""}
            error={confirmError ? sentence(confirmError) : undefined}
          />
        </div>
      }
    >
      Deleting {site.name} also deletes its {contents.stations} stations, {contents.configurations} configurations and{" "}
      {contents.instruments} instruments with their bands. This cannot be undone; export the registry first if you may
      want it back.
    </DeleteCard>
  );
  return (
    <EditorPage
      title={`Edit ${site.name}`}
      lead="Changes apply at once to every sketch and feasibility check that uses the site."
      state={saveState}
      fields={SITE_FIELDS}
      submitLabel="Save site"
      cancelTo={overviewHref(site.id)}
      ariaLabel={`Edit ${site.name}`}
      below={deleteCard}
    >
      <SiteFields state={saveState} defaults={defaults} timeZones={loaderData.timeZones} />
    </EditorPage>
  );
}
