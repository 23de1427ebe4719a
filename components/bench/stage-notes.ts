import type { BringUpStage } from "@/db/schema/listings";

/** What each stage is for, in a line: the order matters because each stage limits what the next can destroy. */
export const STAGE_NOTES: Record<BringUpStage, string> = {
  "control-supply": "The control board alone on a current-limited bench supply; the mains side is not connected.",
  "series-lamp":
    "Mains through a series lamp of about 100 W: it glows while the bus charges, then dims. A lamp that stays bright means something draws current it should not — switch off.",
  "low-current": "A small load with the current limit at its minimum, in short runs.",
  "rated-load": "The rated load in short runs, watching temperatures and the output current.",
};
