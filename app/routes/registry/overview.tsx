import { href } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { ButtonLink, EmptyState, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { getViewer } from "~/lib/guards.server";
import { notFound } from "~/lib/not-found";
import { registryOverview } from "~/services/registry/queries.server";
import { withSite } from "./+shared/links";
import { ConfigurationsCard, DownloadCard, InstrumentsCard } from "./+shared/overview/OfferCards";
import { SiteCard, SiteChooser, StationMapCard, StationsCard } from "./+shared/overview/SiteCards";
import type { Route } from "./+types/overview";

export async function loader({ request, url, context }: Route.LoaderArgs) {
  // The registry is public ("registry:read" is granted to everyone); administrators also get edit controls.
  const viewer = await getViewer(request);
  const canEdit = !!viewer?.permissions.has("registry:edit");
  const page = await registryOverview(context.get(dbContext), { siteParam: url.searchParams.get("site") });
  if (page === "no such site") notFound("There is no site with that number.");
  if (page === "removed") notFound("The site was removed while loading.");
  return { ...page, canEdit };
}

export const meta: Route.MetaFunction = () => [{ title: "Array registry — Fringe Docket" }];

export default function RegistryOverview({ loaderData }: Route.ComponentProps) {
  const { registry, canEdit, sites } = loaderData;
  const importPage = href("/registry/import");
  if (!registry) {
    return (
      <>
        <PageHeader title="Array registry" />
        <EmptyState
          title="No site registered yet"
          action={
            canEdit ? (
              <div className="flex flex-wrap justify-center gap-2">
                <ButtonLink to={href("/registry/sites/new")}>Add the site</ButtonLink>
                <ButtonLink to={importPage} variant="secondary">
                  Import a registry
                </ButtonLink>
              </div>
            ) : undefined
          }
        >
          An administrator adds the site, its stations and instruments.
        </EmptyState>
      </>
    );
  }
  const { site } = registry;
  return (
    <>
      <PageHeader
        title="Array registry"
        lead="The site, its stations, the configurations on offer and the instruments. Everyone can read it; administrators keep it current."
        actions={
          canEdit ? (
            <>
              <ButtonLink to={withSite(importPage, site.id)} variant="secondary">
                Import
              </ButtonLink>
              <ButtonLink to={href("/registry/sites/new")} variant="secondary">
                Add a site
              </ButtonLink>
            </>
          ) : undefined
        }
      />
      <SiteChooser sites={sites} current={site.id} />
      <div className="grid grid-cols-1 gap-6">
        <SiteCard registry={registry} canEdit={canEdit} />
        <StationMapCard registry={registry} />
        <ConfigurationsCard registry={registry} canEdit={canEdit} offeredIn={loaderData.offeredIn} />
        <StationsCard registry={registry} canEdit={canEdit} />
        <InstrumentsCard registry={registry} canEdit={canEdit} />
        <DownloadCard siteId={sites.length > 1 ? site.id : null} />
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
