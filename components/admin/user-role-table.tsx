"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { SkeletonTable } from "@/components/ui/skeleton";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { ErrorState } from "@/components/ui/error-state";
import { EmptyState } from "@/components/ui/empty-state";

type Row = { id: string; email: string | null; name: string | null; createdAt: string; roles: string[] };
type Change = { userId: string; role: string; grant: boolean };

const GRANTABLE = ["seller", "reviewer", "moderator", "admin"] as const;

async function fetchUsers(q: string): Promise<Row[]> {
  const res = await fetch(`/api/admin/users${q ? `?q=${encodeURIComponent(q)}` : ""}`, { cache: "no-store" });
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { message?: string } | null)?.message ?? `HTTP ${res.status}`);
  return ((await res.json()) as { users: Row[] }).users;
}

async function postChange({ userId, role, grant }: Change): Promise<void> {
  const res = await fetch(`/api/admin/users/${encodeURIComponent(userId)}/roles`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ role, grant }),
  });
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { message?: string } | null)?.message ?? `HTTP ${res.status}`);
}

export function UserRoleTable({ currentUserId }: { currentUserId: string }) {
  const [search, setSearch] = useState("");
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const queryClient = useQueryClient();
  const users = useQuery({ queryKey: ["admin-users", search], queryFn: () => fetchUsers(search) });
  const change = useMutation({
    mutationFn: postChange,
    onSuccess: (_data, c) => {
      setMessage({ tone: "success", text: `${c.grant ? "Granted" : "Revoked"} ${c.role}.` });
      return queryClient.invalidateQueries({ queryKey: ["admin-users"] });
    },
    onError: (error) => setMessage({ tone: "error", text: error.message }),
  });

  return (
    <div className="space-y-4">
      <div className="max-w-sm">
        <TextField label="Find a person" type="search" placeholder="name or e-mail" value={search} onChange={(e) => setSearch(e.target.value)} />
      </div>
      <FormMessage tone={message?.tone ?? "info"} message={message?.text} />
      {users.isPending ? (
        <SkeletonTable rows={6} columns={4} />
      ) : users.isError ? (
        <ErrorState title="The list of people could not be loaded">{users.error.message}</ErrorState>
      ) : users.data.length === 0 ? (
        <EmptyState title="Nobody matches that search" />
      ) : (
        <Table caption="People and their roles" captionHidden>
          <THead>
            <TRow>
              <TH>Person</TH>
              <TH>Roles</TH>
              <TH>Joined</TH>
              <TH>Change</TH>
            </TRow>
          </THead>
          <TBody>
            {users.data.map((u) => (
              <TRow key={u.id} data-testid={`user-row-${u.email}`}>
                <TD>
                  <div className="font-medium">{u.name ?? "—"}</div>
                  <div className="font-mono text-xs text-graphite-600">{u.email}</div>
                </TD>
                <TD>
                  <div className="flex flex-wrap gap-1">
                    <StateBadge label="member" />
                    {u.roles.filter((r) => r !== "member").map((r) => (
                      <StateBadge key={r} label={r} tone="active" />
                    ))}
                  </div>
                </TD>
                <TD className="whitespace-nowrap font-mono text-xs">{new Date(u.createdAt).toISOString().slice(0, 10)}</TD>
                <TD>
                  <div className="flex flex-wrap gap-1">
                    {GRANTABLE.map((role) => {
                      const held = u.roles.includes(role);
                      // An admin cannot remove their own admin role and lock everyone out by accident.
                      const self = u.id === currentUserId && role === "admin";
                      return (
                        <Button
                          key={role}
                          size="sm"
                          variant={held ? "secondary" : "quiet"}
                          disabled={change.isPending || self}
                          onClick={() => change.mutate({ userId: u.id, role, grant: !held })}
                        >
                          {held ? `Revoke ${role}` : `Grant ${role}`}
                        </Button>
                      );
                    })}
                  </div>
                </TD>
              </TRow>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}
