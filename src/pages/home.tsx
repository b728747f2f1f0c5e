import { useQuery } from "@tanstack/react-query";
import { meQueryOptions } from "../api/auth";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Loading } from "../components/ui/spinner";
import { PublicHome } from "../features/home/public-home";
import { RoleHome } from "../features/home/role-home";

// The root loader has already warmed meQueryOptions, so this reads from the cache.
export function Component() {
  const me = useQuery(meQueryOptions);
  if (me.isPending) return <Loading />;
  if (me.isError) return <QueryError error={me.error} onRetry={() => me.refetch()} what="your account" />;
  return <PanelBoundary name="the home page">{me.data ? <RoleHome user={me.data} /> : <PublicHome />}</PanelBoundary>;
}
