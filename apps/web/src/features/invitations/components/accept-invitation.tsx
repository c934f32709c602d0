import { newcomerAccountSchema, roleLabels, type InvitationPreview } from "@ringdown/contracts";
import { Link, useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { PasswordField, TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { Notice } from "@/components/ui/page-header";
import { LoadingState } from "@/components/ui/spinner";
import { isApiError } from "@/lib/api-client";
import { useLogout, useMe } from "@/lib/auth";
import { useAcceptInvitation, useInvitationPreview } from "../api/invitation";

const closed: Record<Exclude<InvitationPreview["status"], "pending">, { title: string; text: string }> = {
  expired: { title: "This invitation has expired", text: "Invitation links work for 7 days. Ask the shop's owner to send a new one." },
  accepted: { title: "This invitation has already been used", text: "Each invitation link works once. If it was you, sign in to reach the shop." },
  revoked: {
    title: "This invitation is no longer valid",
    text: "The owner withdrew it or sent a newer link. Use the latest invitation e-mail, or ask the shop's owner.",
  },
};

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: "medium", timeStyle: "short" });

/** Everything the invitation page shows: the offer, and the one way to accept that fits the person. */
export function AcceptInvitation({ token }: { token: string }) {
  const preview = useInvitationPreview(token);
  const me = useMe();

  if (preview.isPending || me.isPending) return <LoadingState label="Opening the invitation…" />;
  if (preview.isError) {
    const notFound = isApiError(preview.error) && (preview.error.status === 404 || preview.error.status === 400);
    return (
      <div className="flex flex-col gap-4 text-sm">
        <p role="alert" className="text-ink">
          {notFound ? "This invitation link is not valid. Check that the whole link was copied from the e-mail." : preview.error.message}
        </p>
        <Link to="/sign-in" className="font-medium text-brand underline underline-offset-4">
          Go to sign-in
        </Link>
      </div>
    );
  }
  const invitation = preview.data;
  if (invitation.status !== "pending") {
    const words = closed[invitation.status];
    return (
      <div className="flex flex-col gap-4 text-sm">
        <h2 className="text-base font-semibold text-ink">{words.title}</h2>
        <p role="alert" className="text-ink">
          {words.text}
        </p>
        <p className="text-muted">
          Shop: {invitation.shopName} · for {invitation.email}
        </p>
        <Link to="/sign-in" className="font-medium text-brand underline underline-offset-4">
          Go to sign-in
        </Link>
      </div>
    );
  }

  const summary = (
    <p className="mb-5 text-sm text-ink">
      {invitation.invitedByName ?? "The owner"} invited <strong>{invitation.email}</strong> to join <strong>{invitation.shopName}</strong> as{" "}
      <strong>{roleLabels[invitation.role].toLowerCase()}</strong>. The link works until {dateFormat.format(new Date(invitation.expiresAt))}.
    </p>
  );

  if (me.data) {
    return (
      <>
        {summary}
        {me.data.user.email === invitation.email ? (
          <JoinAsSignedIn token={token} shopName={invitation.shopName} />
        ) : (
          <WrongAccount invited={invitation.email} current={me.data.user.email} />
        )}
      </>
    );
  }
  if (invitation.accountExists) {
    const next = encodeURIComponent(`/invitations/${token}`);
    return (
      <>
        {summary}
        <p className="mb-4 text-sm text-muted">{invitation.email} already has a Ringdown account. Sign in, and you come back here to join.</p>
        <Link
          to={`/sign-in?next=${next}`}
          className="inline-flex h-10 w-full items-center justify-center rounded-md bg-brand px-4 text-sm font-medium text-white hover:bg-brand-strong"
        >
          Sign in to accept
        </Link>
      </>
    );
  }
  return (
    <>
      {summary}
      <NewcomerForm token={token} />
    </>
  );
}

function JoinAsSignedIn({ token, shopName }: { token: string; shopName: string }) {
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();
  return (
    <div className="flex flex-col gap-3">
      {accept.isError && <Notice tone="limit">{accept.error.message}</Notice>}
      <Button className="w-full" pending={accept.isPending} onClick={() => accept.mutate({}, { onSuccess: () => void navigate("/team", { replace: true }) })}>
        Join {shopName}
      </Button>
    </div>
  );
}

function WrongAccount({ invited, current }: { invited: string; current: string }) {
  const logout = useLogout();
  return (
    <div className="flex flex-col gap-3 text-sm">
      <Notice tone="limit">
        This invitation is for {invited}, but you are signed in as {current}. Sign out, then open the link again.
      </Notice>
      <Button variant="secondary" pending={logout.isPending} onClick={() => logout.mutate()}>
        Sign out
      </Button>
    </div>
  );
}

function NewcomerForm({ token }: { token: string }) {
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();
  return (
    <Form
      schema={newcomerAccountSchema}
      defaultValues={{ name: "", password: "" }}
      aria-label="Create your account"
      className="flex flex-col gap-4"
      onSubmit={async (values) => {
        await accept.mutateAsync(values);
        void navigate("/", { replace: true });
      }}
    >
      {({ formState }) => (
        <>
          <FormError />
          <TextField name="name" label="Your name" autoComplete="name" autoFocus />
          <PasswordField name="password" label="Choose a password" autoComplete="new-password" hint="At least 10 characters." />
          <Button type="submit" pending={formState.isSubmitting} className="mt-1 w-full">
            Create account and join
          </Button>
        </>
      )}
    </Form>
  );
}
