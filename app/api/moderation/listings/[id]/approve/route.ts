import { listingActionRoute } from "@/lib/moderation/listing-route";

export const dynamic = "force-dynamic";

export const POST = listingActionRoute("approve");
