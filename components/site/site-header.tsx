import Link from "next/link";
import { AccountControls, AreaLinks, HeaderLink } from "./header-session";
import { PUBLIC_LINKS } from "./nav-links";

/**
 * The same for every visitor, so the layout never reads the session and pages can be cached; the
 * per-person links and controls fill in on the client (header-session.tsx). The nav is one line
 * that scrolls sideways rather than wrapping, so links that arrive after load shift nothing.
 */
export function SiteHeader() {
  return (
    <header className="bg-graphite-900 text-paper-sunken">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" className="flex h-8 items-center gap-2 text-lg font-bold tracking-wide text-copper-300 no-underline hover:text-copper-200">
          <LogoMark />
          Fluxyard
        </Link>
        <nav
          aria-label="Main"
          className="order-last flex h-7 w-full items-center gap-x-4 overflow-x-auto whitespace-nowrap text-sm [scrollbar-width:none] md:order-none md:w-auto md:min-w-0 md:flex-1"
        >
          {PUBLIC_LINKS.map((l) => (
            <HeaderLink key={l.href} link={l} />
          ))}
          <AreaLinks />
        </nav>
        <AccountControls className="ml-auto md:ml-0" />
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
