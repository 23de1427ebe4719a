// Who the fuzzed request is from. The test files replace Auth.js's `auth()` with a reader of this
// holder (vi.mock of lib/auth/config), so the real guard still loads the person's roles from the
// database and each request reaches the input parsing of the role it was aimed at.
export const fuzzSession: { userId: string | null } = { userId: null };

export async function fakeAuth(): Promise<{ user: { id: string } } | null> {
  return fuzzSession.userId ? { user: { id: fuzzSession.userId } } : null;
}
