/**
 * What the Sketchpad and the Triangle finder have in common around their own page: the loader data
 * they receive, and the empty page shown while no site is registered.
 */
import type { ComponentType } from "react";
import { EmptyState, PageHeader } from "~/components/ui";
import type { SavedTarget } from "~/services/sketch/models";
import type { loadSketchPage } from "~/services/sketch/page.server";
import type { SketchRegistry } from "~/services/sketch/registry";
import type { StateDefaults } from "~/services/sketch/state";

/** The props of either page: the site's registry, the defaults of its inputs and the viewer's targets. */
export interface SketchPageProps {
  registry: SketchRegistry;
  defaults: StateDefaults;
  multiSite: boolean;
  savedTargets?: SavedTarget[];
}

/** The page `Page` with the loader's data, or an empty page titled `title` while no site is registered. */
export function SketchPage({
  title,
  data,
  Page,
}: {
  title: string;
  data: Awaited<ReturnType<typeof loadSketchPage>>;
  Page: ComponentType<SketchPageProps>;
}) {
  const { loaded } = data;
  if (!loaded) {
    return (
      <>
        <PageHeader title={title} />
        <EmptyState title="No site registered yet">
          An administrator adds the site, its stations and instruments first.
        </EmptyState>
      </>
    );
  }
  return (
    <Page
      registry={loaded.registry}
      defaults={loaded.defaults}
      multiSite={loaded.siteNames.length > 1}
      savedTargets={data.savedTargets}
    />
  );
}
