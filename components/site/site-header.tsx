import Link from "next/link";
import { getSessionUser } from "@/lib/auth/guard";
import { signOutAction } from "@/app/(account)/sign-in/actions";
import { navLinksFor } from "./nav-links";

export async function SiteHeader() {
  const user = await getSessionUser();
  const links = navLinksFor(user);
  return (
    <header className="bg-graphite-900 text-paper-sunken">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" className="flex items-center gap-2 text-lg font-bold tracking-wide text-copper-300 no-underline hover:text-copper-200">
          <LogoMark />
          Fluxyard
        </Link>
        <nav aria-label="Main" className="flex flex-1 flex-wrap gap-x-4 gap-y-1 text-sm">
          {links.map((l) => (
            <Link key={l.href} href={l.href} className="text-graphite-100 no-underline hover:text-white hover:underline">
              {l.label}
            </Link>
          ))}
        </nav>
        <div className="flex items-center gap-3 text-sm">
          {user ? (
            <>
              <Link href="/account" className="text-graphite-100 no-underline hover:text-white" data-testid="signed-in-as">
                {user.name ?? user.email}
              </Link>
              <form action={signOutAction}>
                <button type="submit" className="rounded border border-graphite-600 px-3 py-1 text-graphite-100 hover:border-graphite-400 hover:text-white">
                  Sign out
                </button>
              </form>
            </>
          ) : (
            <Link href="/sign-in" className="rounded bg-copper-600 px-3 py-1.5 font-medium text-white no-underline hover:bg-copper-700">
              Sign in
            </Link>
          )}
        </div>
      </div>
    </header>
  );
}

/** A toroid seen from above with its winding: our own mark. */
function LogoMark() {
  return (
    <svg width="22" height="22" viewBox="0 0 24 24" aria-hidden="true" focusable="false">
      <circle cx="12" cy="12" r="8.5" fill="none" stroke="currentColor" strokeWidth="3" />
      <circle cx="12" cy="12" r="3.2" fill="none" stroke="currentColor" strokeWidth="1.2" />
      {[0, 45, 90, 135, 180, 225, 270, 315].map((a) => (
        <line key={a} x1="12" y1="1.5" x2="12" y2="6.5" stroke="#f8e7dc" strokeWidth="1.1" transform={`rotate(${a} 12 12)`} />
      ))}
    </svg>
  );
}
