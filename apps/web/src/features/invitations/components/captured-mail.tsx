import { capturedMailListSchema } from "@ringdown/contracts";
import { useQuery } from "@tanstack/react-query";
import { Mail } from "lucide-react";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice, PageHeader } from "@/components/ui/page-header";
import { LoadingState } from "@/components/ui/spinner";
import { apiRequest, isApiError } from "@/lib/api-client";

const timeFormat = new Intl.DateTimeFormat(undefined, { dateStyle: "medium", timeStyle: "medium" });

/**
 * Development only: the messages the local capture server received, so invitation and reset links
 * can be followed without a real mailbox. The server answers 404 when capture is off.
 */
export function CapturedMail() {
  const mail = useQuery({
    queryKey: ["dev-mail"],
    queryFn: ({ signal }) => apiRequest("/dev/mail", { schema: capturedMailListSchema, signal }),
    refetchInterval: 3000,
    retry: false,
  });
  return (
    <div className="mx-auto flex max-w-4xl flex-col gap-6 px-4 py-8">
      <PageHeader
        title="Captured e-mail (development)"
        description="Messages sent by this server are stored by the local capture server instead of being delivered. Newest first; refreshes every few seconds."
        actions={
          <Button variant="secondary" size="sm" onClick={() => void mail.refetch()} pending={mail.isFetching}>
            Refresh
          </Button>
        }
      />
      {mail.isPending && <LoadingState label="Reading captured mail…" />}
      {mail.isError &&
        (isApiError(mail.error) && mail.error.status === 404 ? (
          <Card>
            <EmptyState icon={Mail} title="Mail capture is off on this server">
              <p>This page exists only in development, where the local capture server stores outgoing e-mail.</p>
            </EmptyState>
          </Card>
        ) : (
          <Notice tone="limit">{mail.error.message}</Notice>
        ))}
      {mail.data && mail.data.items.length === 0 && (
        <Card>
          <EmptyState icon={Mail} title="No messages yet">
            <p>Invite someone or ask for a password reset; the message appears here.</p>
          </EmptyState>
        </Card>
      )}
      {mail.data?.items.map((m) => (
        <article key={m.id} aria-label={`Message to ${m.to.join(", ")}: ${m.subject}`}>
        <Card>
          <CardHeader
            title={m.subject || "(no subject)"}
            description={`To ${m.to.join(", ")} · from ${m.from} · ${timeFormat.format(new Date(m.receivedAt))}`}
          />
          <CardBody className="flex flex-col gap-3 text-sm">
            {m.links.length > 0 && (
              <ul className="flex flex-col gap-1" aria-label="Links in this message">
                {m.links.map((link) => (
                  <li key={link}>
                    <a href={link} className="font-medium break-all text-brand underline underline-offset-4">
                      {link}
                    </a>
                  </li>
                ))}
              </ul>
            )}
            <details>
              <summary className="cursor-pointer text-muted">Plain-text part</summary>
              <pre className="mt-2 font-sans text-sm whitespace-pre-wrap text-ink">{m.text}</pre>
            </details>
            {m.hasHtml && (
              <a href={`/api/dev/mail/${encodeURIComponent(m.id)}/html`} target="_blank" rel="noreferrer" className="text-muted underline">
                HTML part (opens in a new tab)
              </a>
            )}
          </CardBody>
        </Card>
        </article>
      ))}
    </div>
  );
}
