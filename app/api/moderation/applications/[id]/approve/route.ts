import { applicationDecisionRoute } from "@/lib/moderation/application-route";

export const dynamic = "force-dynamic";

export const POST = applicationDecisionRoute("approve");
