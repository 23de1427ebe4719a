import type { OrderDetail } from "@/db/queries/orders";
import { formatOrderDateTime } from "./format";

/** What the buyer acknowledged before paying, per mains-connected item, at the sheet revision they read. */
export function AcknowledgementsList({ acknowledgements }: { acknowledgements: OrderDetail["acknowledgements"] }) {
  return (
    <ul className="space-y-3" data-testid="order-acknowledgements">
      {acknowledgements.map((a) => (
        <li key={a.listingId} className="rounded border border-graphite-200 bg-paper-sunken px-3 py-2">
          <p className="font-medium">
            {a.title}{" "}
            <span className="text-sm font-normal text-graphite-600">
              — safety sheet revision <span className="font-mono">{a.sheetRevision}</span>, policy revision <span className="font-mono">{a.policyRevision}</span>
            </span>
          </p>
          {a.hazards.length > 0 ? (
            <ul className="mt-1 list-disc pl-5 text-sm">
              {a.hazards.map((h) => (
                <li key={h}>{h}</li>
              ))}
            </ul>
          ) : null}
          <p className="mt-1 text-xs text-graphite-600">Acknowledged {formatOrderDateTime(a.acknowledgedAt)}</p>
        </li>
      ))}
    </ul>
  );
}
