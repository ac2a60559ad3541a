/**
 * What the Sketchpad and the Triangle finder have in common around their own page: the loader data
 * they receive, and the empty page shown while no site is registered.
 */
import type { ComponentType } from "react";
import { href, Link, useSearchParams } from "react-router";
import { EmptyState, PageHeader } from "~/components/ui";
import type { SavedTarget } from "~/services/sketch/models";
import type { loadSketchPage } from "~/services/sketch/page.server";
import type { SketchRegistry } from "~/services/sketch/registry";
import { FROM_MY_TARGETS, type StateDefaults } from "~/services/sketch/state";
import type { ProposalTargetChoice } from "~/services/sketch/triangle-choice";

/** The props of either page: the site's registry, the defaults of its inputs and the viewer's targets. */
export interface SketchPageProps {
  registry: SketchRegistry;
  defaults: StateDefaults;
  multiSite: boolean;
  savedTargets?: SavedTarget[];
  /** The viewer's editable drafts with their targets, for "Use this triangle" (Triangle finder). */
  proposalTargets?: ProposalTargetChoice[];
  /** Why the last "Use this triangle" was refused (Triangle finder). */
  refusal?: string | null;
}

/** The page `Page` with the loader's data, or an empty page titled `title` while no site is registered. */
export function SketchPage({
  title,
  data,
  Page,
  refusal = null,
}: {
  title: string;
  refusal?: string | null;
  data: Awaited<ReturnType<typeof loadSketchPage>>;
  Page: ComponentType<SketchPageProps>;
}) {
  const { loaded } = data;
  const [params] = useSearchParams();
  const back =
    params.get("from") === FROM_MY_TARGETS ? (
      <Link to={href("/targets")} className="mb-2 inline-block font-medium text-ember-700 underline">
        ← Back to My targets
      </Link>
    ) : null;
  if (!loaded) {
    return (
      <>
        {back}
        <PageHeader title={title} />
        <EmptyState title="No site registered yet">
          An administrator adds the site, its stations and instruments first.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      {back}
      <Page
        registry={loaded.registry}
        defaults={loaded.defaults}
        multiSite={loaded.siteNames.length > 1}
        savedTargets={data.savedTargets}
        proposalTargets={data.proposalTargets}
        refusal={refusal}
      />
    </>
  );
}
