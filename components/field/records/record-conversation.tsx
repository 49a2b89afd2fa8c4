"use client";

import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { MAX_REPLY_LENGTH } from "@/lib/limits/text";
import type { RecordMessage } from "@/lib/offline/records-copy";
import { REVIEWER_TITLE } from "@/lib/review/words";

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });

/** The reviewer's questions and the volunteer's answers on one sighting, oldest first. */
export function Conversation({ messages }: { messages: RecordMessage[] }) {
  return (
    <ol className="space-y-1 text-sm" aria-label="Questions and answers">
      {messages.map((m, i) => (
        <li key={i} className={m.from === "reviewer" ? "" : "border-l-4 border-tideline-600 pl-2"}>
          <strong>{m.from === "reviewer" ? `${REVIEWER_TITLE} asked` : "You answered"}</strong>{" "}
          <span className="text-shingle-600">({when(m.at)})</span>: {m.message ?? "(no message)"}
        </li>
      ))}
    </ol>
  );
}

async function sendReply(sightingId: string, message: string): Promise<{ message: string; at: string }> {
  let res: Response;
  try {
    res = await fetch("/api/field/records/reply", {
      method: "POST",
      credentials: "same-origin",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ sightingId, message }),
    });
  } catch {
    throw new Error("No signal: your answer was not sent. It is still here; send it when you have a signal.");
  }
  const body = (await res.json().catch(() => ({}))) as { error?: { message?: string; fields?: Record<string, string[]> }; message?: string; createdAt?: string };
  if (!res.ok) {
    if (res.status === 401) throw new Error("Sign in again to send your answer. It is still here.");
    throw new Error(body.error?.fields?.message?.[0] ?? body.error?.message ?? "The answer could not be sent.");
  }
  return { message: body.message ?? message, at: body.createdAt ?? new Date().toISOString() };
}

/** The answer box, shown only while the reviewer waits for one; keeps the text until it is sent. */
export function ReplyForm({ sightingId, onSent }: { sightingId: string; onSent: (reply: { message: string; at: string }) => void }) {
  const [message, setMessage] = useState("");
  const reply = useMutation({
    mutationFn: () => sendReply(sightingId, message.trim()),
    onSuccess: (sent) => {
      setMessage("");
      onSent(sent);
    },
  });
  return (
    <form className="mt-2 space-y-2" onSubmit={(e) => { e.preventDefault(); if (!reply.isPending) reply.mutate(); }}>
      <label htmlFor={`reply-${sightingId}`} className="field-label">Your answer</label>
      <textarea id={`reply-${sightingId}`} rows={2} maxLength={MAX_REPLY_LENGTH} className="field-input" value={message} onChange={(e) => setMessage(e.target.value)} required />
      {reply.isError && <p role="alert" className="field-error">{(reply.error as Error).message}</p>}
      <button type="submit" className="btn-quiet min-w-tap" disabled={reply.isPending || message.trim().length === 0}>
        {reply.isPending ? "Sending…" : "Send answer"}
      </button>
    </form>
  );
}
