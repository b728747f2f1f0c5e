import { useEffect, useId, useState } from "react";
import { Link, NavLink, useLocation, useNavigate } from "react-router-dom";
import { useLogout, type User } from "../../api/auth";
import { paths } from "../../config/paths";
import { roleLabels } from "../../lib/roles";
import { Spinner } from "../ui/spinner";
import { navItemsFor } from "./nav-items";
import { ProductMark } from "./product-mark";

const navLink =
  "flex min-h-touch items-center whitespace-nowrap rounded-md px-3 xl:px-2.5 font-semibold text-flux-100 hover:bg-flux-800 hover:text-white " +
  "aria-[current=page]:bg-flux-800 aria-[current=page]:text-white aria-[current=page]:underline aria-[current=page]:decoration-anneal-400 aria-[current=page]:decoration-[3px] aria-[current=page]:underline-offset-8";

export function SiteHeader({ user }: { user: User | null }) {
  const [open, setOpen] = useState(false);
  const menuId = useId();
  const location = useLocation();
  const navigate = useNavigate();
  const logout = useLogout();
  const items = navItemsFor(user);

  // A chosen link closes the small-screen menu.
  useEffect(() => setOpen(false), [location.pathname]);

  const signOut = () =>
    logout.mutate(undefined, { onSettled: () => navigate(paths.signIn.href(), { replace: true }) });

  return (
    <header className="on-dark bg-flux-900 text-white">
      <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2 sm:px-6">
        <Link to={paths.home.href()} className="flex min-h-touch items-center gap-2.5 rounded-md pr-2 text-flux-100">
          <ProductMark />
          <span className="font-display text-h4 font-semibold tracking-tight text-white">Fluxwright</span>
        </Link>

        <button
          type="button"
          className="ml-auto inline-flex min-h-touch min-w-touch items-center justify-center gap-2 rounded-md border border-flux-600 px-3 font-semibold text-flux-100 xl:hidden"
          aria-expanded={open}
          aria-controls={menuId}
          onClick={() => setOpen((value) => !value)}
        >
          <svg className="size-5" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" aria-hidden="true">
            {open ? <path d="M6 6l12 12M18 6L6 18" /> : <path d="M4 7h16M4 12h16M4 17h16" />}
          </svg>
          Menu
        </button>

        <div
          id={menuId}
          className={`${open ? "flex" : "hidden"} w-full flex-col gap-2 pb-2 xl:flex xl:w-auto xl:min-w-0 xl:flex-1 xl:flex-row xl:items-center xl:pb-0`}
        >
          {/* a long staff menu wraps onto a second row inside the header rather than running off the page */}
          <nav aria-label="Main" className="xl:min-w-0 xl:flex-1">
            <ul className="flex flex-col gap-1 xl:flex-row xl:flex-wrap">
              {items.map((item) => (
                <li key={item.to}>
                  <NavLink to={item.to} end={item.end} className={navLink}>
                    {item.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>

          {user && (
            <div className="flex flex-wrap items-center gap-3 border-t border-flux-700 pt-2 xl:flex-nowrap xl:border-0 xl:pt-0">
              {/* In the one-row header the organisation would push the sign-out button onto a second row. */}
              <p className="leading-tight xl:whitespace-nowrap">
                <span className="block font-semibold text-white">{user.name}</span>
                <span className="font-mono text-meta text-flux-200">
                  {roleLabels[user.role]}
                  {user.organizationName ? <span className="xl:hidden"> · {user.organizationName}</span> : null}
                </span>
              </p>
              <button
                type="button"
                onClick={signOut}
                disabled={logout.isPending}
                className="inline-flex min-h-touch items-center gap-2 whitespace-nowrap rounded-md border border-flux-500 px-3 font-semibold text-white hover:bg-flux-800 disabled:opacity-60"
              >
                {logout.isPending && <Spinner />}
                {logout.isPending ? "Signing out…" : "Sign out"}
              </button>
            </div>
          )}
        </div>
      </div>
    </header>
  );
}
