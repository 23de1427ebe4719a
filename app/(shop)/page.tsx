import Link from "next/link";
import { MainsCaution } from "@/components/caution";
import { ButtonLink } from "@/components/ui/button";
import { Figure } from "@/components/ui/figure";
import { listSellers } from "@/db/queries/home";
import { busPeakVoltage, capacitorEnergy, dischargeTime } from "@/lib/engineering";

export const dynamic = "force-dynamic";

// A worked example for the start page: a 230 V build with a 1000 µF bus and a 47 kΩ bleeder.
const EXAMPLE = { vrms: 230, tolerance: 0.1, capacitanceF: 1000e-6, bleederOhm: 47_000 };

export default async function HomePage() {
  const sellers = await listSellers();
  const peak = busPeakVoltage(EXAMPLE.vrms, EXAMPLE.tolerance);
  const energy = capacitorEnergy(EXAMPLE.capacitanceF, peak);
  const wait = dischargeTime({ resistanceOhm: EXAMPLE.bleederOhm, capacitanceF: EXAMPLE.capacitanceF, fromV: peak });

  return (
    <div className="space-y-14">
      <section className="grid gap-8 md:grid-cols-[3fr_2fr] md:items-center">
        <div className="space-y-5">
          <p className="text-sm font-semibold uppercase tracking-widest text-copper-700">Parts and bring-up help</p>
          <h1 className="text-4xl font-bold text-graphite-900">The parts that decide whether a mains build works, and help with its first power-up.</h1>
          <p className="max-w-reading text-lg text-graphite-700">
            Fluxyard is a marketplace for people who build welding inverters, bench supplies, induction heaters and chargers
            outside a factory. Buy a proper board, hand-wound magnetics or a complete kit; keep a bring-up log; ask on the bench;
            or book an experienced builder to review your bring-up photos before you go further.
          </p>
          <div className="flex flex-wrap gap-3">
            <ButtonLink href="/workbench">Open the workbench calculators</ButtonLink>
            <ButtonLink href="/sign-in" variant="secondary">
              Sign in or join
            </ButtonLink>
          </div>
        </div>
        <aside className="rounded-md border border-graphite-200 bg-paper-raised p-5 shadow-sm" aria-labelledby="example-heading">
          <h2 id="example-heading" className="text-sm font-semibold uppercase tracking-wide text-graphite-600">
            Why every listing carries a safety sheet
          </h2>
          <p className="mt-2 text-sm text-graphite-700">
            A {EXAMPLE.vrms} V build rectifies mains onto its bus. With {EXAMPLE.capacitanceF * 1e6} µF of bulk capacitance at
            the top of the mains tolerance:
          </p>
          <dl className="mt-3 grid grid-cols-2 gap-y-2 text-sm">
            <dt className="text-graphite-600">Bus peak</dt>
            <dd className="text-right"><Figure value={peak} unit="V" /></dd>
            <dt className="text-graphite-600">Stored energy</dt>
            <dd className="text-right"><Figure value={energy} unit="J" /></dd>
            <dt className="text-graphite-600">Wait to 60 V through 47 kΩ</dt>
            <dd className="text-right"><Figure value={wait} unit="s" /></dd>
          </dl>
          <p className="mt-3 text-xs text-graphite-600">Fluxyard computes these from each listing&apos;s own figures and checks that its sheet covers them.</p>
        </aside>
      </section>

      <section className="grid gap-6 md:grid-cols-3" aria-label="What Fluxyard offers">
        <Offer title="Boards, magnetics and kits">
          Inverter and supply boards, hand-wound transformers, output chokes and current transformers with their winding figures,
          and kits that say which magnetics they need. Wound parts are the hard thing to buy: they are made to a core, a gap and a
          frequency, not pulled off a reel.
        </Offer>
        <Offer title="A checked safety sheet">
          Every listing declares where it sits in the finished build — mains-connected, bus capacitance, bleeder, live heatsinks,
          welding output — and its sheet must cover the topics that follow. A moderator approves it before it goes live.
        </Offer>
        <Offer title="Help with bring-up">
          Keep a bring-up log against the kit&apos;s checkpoints, from control supply only, through the first power-up behind a
          series lamp, to rated load. Ask on the bench, or book a paid review of your photos and readings.
        </Offer>
      </section>

      <section className="space-y-3" aria-labelledby="coop-heading">
        <h2 id="coop-heading" className="text-2xl font-semibold">Sellers in the Larkspur Yard cooperative</h2>
        <p className="max-w-reading text-graphite-700">
          This installation runs the demo: a makers&apos; cooperative that shares a workshop, winds its own magnetics and brings up
          each other&apos;s builds. Its people and figures are invented.
        </p>
        {sellers.length > 0 ? (
          <ul className="flex flex-wrap gap-2" data-testid="home-sellers">
            {sellers.map((s) => (
              <li key={s.id} className="rounded-full border border-graphite-200 bg-paper-raised px-3 py-1 text-sm">
                {s.name}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-graphite-600">No sellers yet.</p>
        )}
        <p className="text-sm">
          Want to sell? <Link href="/sign-in">Sign in</Link>; sellers are approved by the platform&apos;s staff.
        </p>
      </section>

      <MainsCaution variant="full" />
    </div>
  );
}

function Offer({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div className="rounded-md border border-graphite-200 bg-paper-raised p-5">
      <h2 className="text-lg font-semibold text-graphite-900">{title}</h2>
      <p className="mt-2 text-sm text-graphite-700">{children}</p>
    </div>
  );
}
