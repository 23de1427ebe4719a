"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { useMutation } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";

async function patchStock(listingId: string, stock: number): Promise<number> {
  const res = await fetch(`/api/sell/listings/${encodeURIComponent(listingId)}/stock`, {
    method: "PATCH",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ stock }),
  });
  const json = (await res.json().catch(() => null)) as { stock?: number; message?: string; fieldErrors?: Record<string, string[]> } | null;
  if (!res.ok || typeof json?.stock !== "number") throw new Error(json?.fieldErrors?.stock?.[0] ?? json?.message ?? "The stock could not be saved.");
  return json.stock;
}

/** The stock cell of a desk row: type a number, save; the row keeps what was typed when it is refused. */
export function StockEditor({ listingId, title, stock, disabled }: { listingId: string; title: string; stock: number; disabled?: boolean }) {
  const router = useRouter();
  const [text, setText] = useState(String(stock));
  const [saved, setSaved] = useState(stock);
  const save = useMutation({
    mutationFn: (value: number) => patchStock(listingId, value),
    onSuccess: (value) => {
      setSaved(value);
      setText(String(value));
      router.refresh();
    },
  });
  const value = Number(text);
  const valid = text.trim() !== "" && Number.isInteger(value) && value >= 0 && value <= 10_000;
  const errorId = `stock-error-${listingId}`;
  return (
    <form
      className="flex items-center justify-end gap-1"
      onSubmit={(e) => {
        e.preventDefault();
        if (valid) save.mutate(value);
      }}
    >
      <input
        type="number"
        min={0}
        max={10000}
        step={1}
        value={text}
        disabled={disabled || save.isPending}
        onChange={(e) => setText(e.target.value)}
        aria-label={`Stock of ${title}`}
        aria-invalid={!valid || save.isError ? true : undefined}
        aria-describedby={save.isError || !valid ? errorId : undefined}
        className="figure h-8 w-20 rounded border border-graphite-300 bg-paper-raised px-2 text-right font-mono"
      />
      <Button type="submit" size="sm" variant="quiet" disabled={disabled || !valid || save.isPending || value === saved}>
        Save
      </Button>
      <span id={errorId} aria-live="polite" className="sr-only">
        {!valid ? "Stock is a whole number from 0 to 10 000." : save.isError ? save.error.message : save.isSuccess ? "Saved." : ""}
      </span>
      {!valid || save.isError ? (
        <span className="ml-1 max-w-40 text-left text-xs text-signal-700" aria-hidden="true">
          {!valid ? "0 to 10 000, whole" : save.error?.message}
        </span>
      ) : null}
    </form>
  );
}
