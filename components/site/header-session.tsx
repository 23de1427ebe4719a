"use client";

import Link from "next/link";
import { useSyncExternalStore } from "react";
import { signOutAction } from "@/app/(account)/sign-in/actions";
import { cx } from "@/components/ui/cx";
import { areaLinksFor, type NavLink } from "./nav-links";
import { forgetSession, readSession, sessionBeforeLoad, subscribeToSession, type SessionState } from "./session-store";

// The header's per-person part. The layout is rendered once for everyone (the pages are cached), so
// who is signed in is fetched after load. Until then, and without JavaScript, it shows a visitor's
// header: the Sign in link, and no area links.
//
// Who is signed in comes from ./session-store.ts. Not React Query: the header is on every page, and
// most first screens (home, a listing, checkout) need nothing else from it, so they do without its
// 12 kB (components/query-provider.tsx).

function useHeaderSession(): SessionState {
  return useSyncExternalStore(subscribeToSession, readSession, sessionBeforeLoad);
}

export function HeaderLink({ link }: { link: NavLink }) {
  return (
    <Link href={link.href} className="text-graphite-100 no-underline hover:text-white hover:underline">
      {link.label}
    </Link>
  );
}

/** The links to the areas the signed-in person may enter, after the public ones. */
export function AreaLinks() {
  const { session } = useHeaderSession();
  return areaLinksFor(session?.user ?? null).map((link) => <HeaderLink key={link.href} link={link} />);
}

/**
 * "Signed in as" and Sign out, or Sign in. A fixed height, right-aligned, so the swap after the
 * fetch moves nothing else in the header.
 */
export function AccountControls({ className }: { className?: string }) {
  const { session, status } = useHeaderSession();
  const user = session?.user ?? null;
  return (
    <div
      className={cx("flex h-8 min-w-0 items-center justify-end gap-3 text-sm", className)}
      data-testid="account-controls"
      data-session={status === "pending" ? "pending" : user ? "signed-in" : "visitor"}
    >
      {user ? (
        <>
          <Link href="/account" className="min-w-0 max-w-56 truncate text-graphite-100 no-underline hover:text-white" data-testid="signed-in-as">
            {user.label}
          </Link>
          {/* The action signs out and redirects; the header forgets the person at once. */}
          <form action={signOutAction} onSubmit={forgetSession}>
            <button type="submit" className="h-8 shrink-0 rounded border border-graphite-600 px-3 text-graphite-100 hover:border-graphite-400 hover:text-white">
              Sign out
            </button>
          </form>
        </>
      ) : (
        <Link href="/sign-in" className="inline-flex h-8 shrink-0 items-center rounded bg-copper-600 px-3 font-medium text-white no-underline hover:bg-copper-700">
          Sign in
        </Link>
      )}
    </div>
  );
}
