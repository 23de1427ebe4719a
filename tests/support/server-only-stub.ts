// Vitest runs outside the React server runtime, where "server-only" would throw on import.
export {};
