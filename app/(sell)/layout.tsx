// This area's interactive parts keep server state with React Query: the layout is the provider.
export { QueryProvider as default } from "@/components/query-provider";
