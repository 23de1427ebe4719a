import type { CheckpointView, ReadingView } from "@/db/queries/bench";
import { cautionFor } from "@/lib/bench/cautions";
import { formatReading, formatTakenAt } from "./format";
import { ReadingCaution } from "./reading-caution";
import { VerdictBadge } from "./verdict-badge";

function ReadingItem({ checkpoint, reading, latest }: { checkpoint: CheckpointView; reading: ReadingView; latest: boolean }) {
  const caution = cautionFor({ ...checkpoint, verdict: reading.verdict, farOutside: reading.farOutside });
  const converted = reading.enteredUnit !== checkpoint.unit;
  return (
    <li className="rounded border border-graphite-200 bg-paper px-3 py-2" data-testid="reading" data-verdict={reading.verdict}>
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <data value={String(reading.value)} className="figure font-mono text-lg font-semibold text-graphite-900" data-testid="reading-value">
          {formatReading(reading.value, checkpoint.unit)}
        </data>
        <VerdictBadge verdict={reading.verdict} farOutside={reading.farOutside} />
        {latest ? <span className="text-xs font-semibold text-graphite-600 uppercase">latest</span> : null}
        <span className="text-sm text-graphite-600">{formatTakenAt(reading.takenAt)}</span>
      </div>
      <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
        {converted ? (
          <>
            <dt className="text-graphite-600">Entered as</dt>
            <dd className="figure font-mono">{formatReading(reading.enteredValue, reading.enteredUnit)}</dd>
          </>
        ) : null}
        {reading.instrument !== "" ? (
          <>
            <dt className="text-graphite-600">Instrument</dt>
            <dd>{reading.instrument}</dd>
          </>
        ) : null}
        {reading.note !== "" ? (
          <>
            <dt className="text-graphite-600">Note</dt>
            <dd className="whitespace-pre-line">{reading.note}</dd>
          </>
        ) : null}
      </dl>
      {reading.photos.length > 0 ? (
        <ul className="mt-2 flex flex-wrap gap-2" aria-label="Photos of this reading">
          {reading.photos.map((photo) => (
            <li key={photo.key} className="w-32">
              <a href={photo.url} target="_blank" rel="noreferrer" className="block">
                {/* Plain <img>: the uploads host and the sizes are not known to next/image. */}
                {/* eslint-disable-next-line @next/next/no-img-element */}
                <img
                  src={photo.thumbUrl}
                  alt={photo.caption || `Photo of the reading at ${checkpoint.name}`}
                  className="h-24 w-32 rounded-sm border border-graphite-200 bg-graphite-100 object-cover"
                  data-testid="reading-photo"
                />
              </a>
              {photo.caption !== "" ? <p className="mt-1 text-xs text-graphite-600">{photo.caption}</p> : null}
            </li>
          ))}
        </ul>
      ) : null}
      {caution ? <ReadingCaution caution={caution} /> : null}
    </li>
  );
}

/** A checkpoint's readings, newest first; only the newest counts in the progress view. */
export function ReadingList({ checkpoint }: { checkpoint: CheckpointView }) {
  if (checkpoint.readings.length === 0) return <p className="text-sm text-graphite-600">No reading yet.</p>;
  const newestFirst = [...checkpoint.readings].reverse();
  return (
    <ol className="space-y-2" aria-label={`Readings at ${checkpoint.name}, newest first`}>
      {newestFirst.map((reading, index) => (
        <ReadingItem key={reading.id} checkpoint={checkpoint} reading={reading} latest={index === 0 && newestFirst.length > 1} />
      ))}
    </ol>
  );
}
