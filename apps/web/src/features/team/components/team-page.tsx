import {
  createInvitationBodySchema,
  isPaidRole,
  roleLabels,
  roles,
  type CreateInvitationBody,
  type Invitation,
  type Member,
  type Role,
} from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { Users } from "lucide-react";
import { useMemo, useState } from "react";
import { Link } from "react-router-dom";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { Notice, PageHeader } from "@/components/ui/page-header";
import { Select, SelectField } from "@/components/ui/select";
import { useActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useDocumentTitle } from "@/lib/use-document-title";
import { useInvitations, useInvite, useResendInvitation, useRevokeInvitation } from "../api/invitations";
import { useChangeRole, useMembers, useRemoveMember } from "../api/members";
import { usePlan } from "../api/plan";

const roleOptions = roles.map((r) => ({ value: r, label: roleLabels[r] }));

const roleHelp: Record<Role, string> = {
  owner: "manages the team and billing",
  tooling_manager: "curates cutters, approves recipes",
  programmer: "plans and proposes recipes",
  operator: "reads recipes and logs cuts (free)",
};

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: "medium", timeStyle: "short" });
const formatDate = (iso: string) => dateFormat.format(new Date(iso));

function errorText(error: unknown): string {
  return isApiError(error) || error instanceof Error ? error.message : "Something went wrong. Try again.";
}

/** The Team area: who is in the shop with which role; owners invite, change roles and remove. */
export function TeamPage() {
  useDocumentTitle("Team");
  const shop = useActiveShop();
  if (!shop) {
    return (
      <Card>
        <EmptyState icon={Users} title="No shop selected">
          <p>Create or choose a shop to see its team.</p>
        </EmptyState>
      </Card>
    );
  }
  return <TeamForShop shopId={shop.shopId} shopName={shop.shopName} isOwner={shop.role === "owner"} userId={shop.userId} />;
}

function TeamForShop({ shopId, shopName, isOwner, userId }: { shopId: string; shopName: string; isOwner: boolean; userId: string }) {
  const members = useMembers(shopId);
  const plan = usePlan(shopId);
  const invitations = useInvitations(shopId, isOwner);
  const changeRole = useChangeRole(shopId);
  const removeMember = useRemoveMember(shopId);
  const resend = useResendInvitation(shopId);
  const revoke = useRevokeInvitation(shopId);
  const [notice, setNotice] = useState<{ tone: "ok" | "limit"; text: string } | null>(null);
  const [removing, setRemoving] = useState<Member | null>(null);
  const [revoking, setRevoking] = useState<Invitation | null>(null);

  const seats = plan.data?.seats;

  const memberColumns = useMemo<Array<ColumnDef<Member>>>(
    () => [
      { accessorKey: "name", header: "Name", cell: (c) => <span className="font-medium text-ink">{c.row.original.name}</span> },
      { accessorKey: "email", header: "E-mail" },
      {
        accessorKey: "role",
        header: "Role",
        cell: ({ row }) => {
          const m = row.original;
          if (!isOwner) return roleLabels[m.role];
          return (
            <Select
              aria-label={`Role of ${m.name}`}
              value={m.role}
              options={roleOptions}
              className="h-8 min-w-44"
              disabled={changeRole.isPending}
              onChange={(event) => {
                const role = event.target.value as Role;
                setNotice(null);
                changeRole.mutate(
                  { userId: m.userId, role },
                  {
                    onSuccess: () => setNotice({ tone: "ok", text: `${m.name} is now ${roleLabels[role].toLowerCase()}.` }),
                    onError: (error) => setNotice({ tone: "limit", text: errorText(error) }),
                  },
                );
              }}
            />
          );
        },
      },
      {
        id: "seat",
        header: "Seat",
        enableSorting: false,
        cell: ({ row }) => (isPaidRole(row.original.role) ? <Badge tone="brand">paid</Badge> : <Badge>free</Badge>),
      },
    ],
    [isOwner, changeRole],
  );

  const invitationColumns = useMemo<Array<ColumnDef<Invitation>>>(
    () => [
      { accessorKey: "email", header: "E-mail" },
      { accessorKey: "role", header: "Role", cell: (c) => roleLabels[c.row.original.role] },
      {
        accessorKey: "status",
        header: "Status",
        cell: (c) => (c.row.original.status === "expired" ? <Badge tone="near">expired</Badge> : <Badge tone="ok">waiting</Badge>),
      },
      { accessorKey: "sentAt", header: "Sent", cell: (c) => formatDate(c.row.original.sentAt) },
      { accessorKey: "expiresAt", header: "Link works until", cell: (c) => formatDate(c.row.original.expiresAt) },
    ],
    [],
  );

  return (
    <div className="mx-auto flex max-w-5xl flex-col gap-6">
      <PageHeader
        title="Team"
        description={`The people in ${shopName} and what each may do.`}
        actions={
          seats && (
            <p className="text-sm text-muted" aria-live="polite">
              Paid seats: <span className="font-medium text-ink tabular-nums">{seats.used}</span> of{" "}
              <span className="font-medium text-ink tabular-nums">{seats.paid}</span> in use · operators free
              {isOwner && (
                <>
                  {" · "}
                  <Link to="/billing" className="font-medium text-brand underline underline-offset-4">
                    Billing
                  </Link>
                  {" · "}
                  <Link to="/team/history" className="font-medium text-brand underline underline-offset-4">
                    Change history
                  </Link>
                </>
              )}
            </p>
          )
        }
      />

      {plan.data?.readOnly && (
        <Notice tone="limit">
          <strong>Read-only.</strong> {plan.data.readOnlyReason}
        </Notice>
      )}
      {notice && (
        <Notice tone={notice.tone} onDismiss={() => setNotice(null)}>
          {notice.text}
        </Notice>
      )}

      <section aria-labelledby="members-heading" className="flex flex-col gap-3">
        <h2 id="members-heading" className="text-base font-semibold text-ink">
          Members
        </h2>
        <DataTable
          label="Members of the shop"
          columns={memberColumns}
          data={members.data?.items}
          getRowId={(m) => m.userId}
          isLoading={members.isPending}
          error={members.error}
          onRetry={() => void members.refetch()}
          empty={<p className="text-muted">Nobody is in this shop yet.</p>}
          rowActions={
            isOwner
              ? (m) => (
                  <Button variant="quiet" size="sm" onClick={() => setRemoving(m)} aria-label={`Remove ${m.name}`}>
                    Remove
                  </Button>
                )
              : undefined
          }
        />
      </section>

      {isOwner && (
        <>
          <Card>
            <CardHeader
              title="Invite someone"
              description="They get an e-mail with a link that works once, for 7 days. Owners, tooling managers and programmers take a paid seat; operators are free."
            />
            <CardBody>
              <InviteForm
                shopId={shopId}
                onSent={(email) => setNotice({ tone: "ok", text: `Invitation sent to ${email}.` })}
              />
            </CardBody>
          </Card>

          <section aria-labelledby="invitations-heading" className="flex flex-col gap-3">
            <h2 id="invitations-heading" className="text-base font-semibold text-ink">
              Pending invitations
            </h2>
            <DataTable
              label="Pending invitations"
              columns={invitationColumns}
              data={invitations.data?.items}
              getRowId={(i) => i.id}
              isLoading={invitations.isPending}
              error={invitations.error}
              onRetry={() => void invitations.refetch()}
              empty={<p className="text-muted">No invitations waiting. Invite someone above.</p>}
              rowActions={(i) => (
                <div className="flex justify-end gap-1">
                  <Button
                    variant="quiet"
                    size="sm"
                    pending={resend.isPending && resend.variables === i.id}
                    aria-label={`Re-send the invitation to ${i.email}`}
                    onClick={() =>
                      resend.mutate(i.id, {
                        onSuccess: () => setNotice({ tone: "ok", text: `A new link was sent to ${i.email}; the old one no longer works.` }),
                        onError: (error) => setNotice({ tone: "limit", text: errorText(error) }),
                      })
                    }
                  >
                    Re-send
                  </Button>
                  <Button variant="quiet" size="sm" aria-label={`Revoke the invitation to ${i.email}`} onClick={() => setRevoking(i)}>
                    Revoke
                  </Button>
                </div>
              )}
            />
          </section>
        </>
      )}

      <ConfirmDialog
        open={removing !== null}
        onClose={() => {
          setRemoving(null);
          removeMember.reset();
        }}
        title={removing ? `Remove ${removing.name}?` : "Remove"}
        confirmLabel="Remove from the shop"
        danger
        pending={removeMember.isPending}
        error={removeMember.error ? errorText(removeMember.error) : null}
        onConfirm={() => {
          if (!removing) return;
          const who = removing;
          removeMember.mutate(who.userId, {
            onSuccess: () => {
              setRemoving(null);
              if (who.userId === userId) window.location.replace("/sign-in");
              setNotice({ tone: "ok", text: `${who.name} was removed. Their recipes and cut logs stay with the shop.` });
            },
          });
        }}
      >
        {removing && (
          <p>
            {removing.name} ({removing.email}) loses access to this shop at once and is signed out everywhere. Their recipes and cut
            logs stay with the shop.
          </p>
        )}
      </ConfirmDialog>

      <ConfirmDialog
        open={revoking !== null}
        onClose={() => {
          setRevoking(null);
          revoke.reset();
        }}
        title="Revoke this invitation?"
        confirmLabel="Revoke"
        danger
        pending={revoke.isPending}
        error={revoke.error ? errorText(revoke.error) : null}
        onConfirm={() => {
          if (!revoking) return;
          const email = revoking.email;
          revoke.mutate(revoking.id, {
            onSuccess: () => {
              setRevoking(null);
              setNotice({ tone: "ok", text: `The invitation to ${email} was revoked; its link no longer works.` });
            },
          });
        }}
      >
        {revoking && <p>The link sent to {revoking.email} stops working. You can invite them again later.</p>}
      </ConfirmDialog>
    </div>
  );
}

function InviteForm({ shopId, onSent }: { shopId: string; onSent: (email: string) => void }) {
  const invite = useInvite(shopId);
  const [formKey, setFormKey] = useState(0);
  return (
    <Form
      key={formKey}
      schema={createInvitationBodySchema}
      defaultValues={{ email: "", role: "programmer" }}
      aria-label="Invite someone"
      className="grid gap-4 sm:grid-cols-[2fr_1.4fr_auto] sm:items-start"
      onSubmit={async (values: CreateInvitationBody) => {
        await invite.mutateAsync(values);
        onSent(values.email);
        setFormKey((k) => k + 1);
      }}
    >
      {({ formState, watch }) => (
        <>
          <div className="sm:col-span-3">
            <FormError />
          </div>
          <TextField name="email" label="E-mail" type="email" autoComplete="off" inputMode="email" />
          <SelectField name="role" label="Role" options={roleOptions} hint={roleHelp[(watch("role") as Role | undefined) ?? "programmer"]} />
          <Button type="submit" pending={formState.isSubmitting} className="sm:mt-7">
            Send invitation
          </Button>
        </>
      )}
    </Form>
  );
}
