"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect } from "react";
import { useForm } from "react-hook-form";
import { licenceLabel, RECORD_LICENCES, type RecordLicence } from "@/lib/agreement/licences";
import { ApiError, api } from "../transects/api";
import { agreementSchema, MAX_AGREEMENT_LENGTH, type AgreementInput, type AgreementValues } from "./schema";

type Version = { version: number; body: string; licence: RecordLicence; createdAt: string; createdBy: string | null; accepted: number };
const key = ["network", "agreement"] as const;

export function AgreementEditor() {
  const queryClient = useQueryClient();
  const versions = useQuery({ queryKey: key, queryFn: () => api<{ versions: Version[] }>("/api/network/agreement") });
  const current = versions.data?.versions[0];
  const { register, handleSubmit, reset, setError, formState: { errors, isDirty } } = useForm<AgreementInput, unknown, AgreementValues>({
    resolver: zodResolver(agreementSchema),
    defaultValues: { body: "", licence: "CC-BY-4.0" },
  });
  useEffect(() => {
    if (current) reset({ body: current.body, licence: current.licence });
  }, [current, reset]);
  const publish = useMutation({
    mutationFn: (values: AgreementValues) => api<{ version: number }>("/api/network/agreement", { body: values }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: key }),
    onError: (error) => {
      if (error instanceof ApiError) for (const f of ["body", "licence"] as const) if (error.fields[f]) setError(f, { message: error.fields[f]![0]! });
    },
  });

  if (versions.isPending) return <p role="status">Loading the agreement…</p>;
  if (versions.error) return <p role="alert" className="font-bold text-rust-700">{versions.error.message}</p>;
  return (
    <>
      <form noValidate onSubmit={handleSubmit((v) => publish.mutate(v))} className="card space-y-3">
        <h2 className="text-xl font-bold">{current ? `Version ${current.version} (change it to make version ${current.version + 1})` : "Write the first version"}</h2>
        <div>
          <label htmlFor="agreement-body" className="field-label">How the network uses sightings</label>
          <textarea id="agreement-body" rows={12} maxLength={MAX_AGREEMENT_LENGTH} className="field-input" aria-invalid={Boolean(errors.body)} aria-describedby={errors.body ? "agreement-body-error" : undefined} {...register("body")} />
          {errors.body && <p id="agreement-body-error" className="field-error">{errors.body.message}</p>}
        </div>
        <fieldset>
          <legend className="field-label">Licence sightings are published under</legend>
          {RECORD_LICENCES.map((l) => (
            <label key={l} className="flex min-h-tap items-center gap-2">
              <input type="radio" className="h-5 w-5" value={l} {...register("licence")} />
              {licenceLabel[l]}
            </label>
          ))}
          {errors.licence && <p className="field-error">{errors.licence.message}</p>}
        </fieldset>
        <button type="submit" className="btn-primary" disabled={publish.isPending || (Boolean(current) && !isDirty)}>
          {current ? "Save as a new version" : "Publish the agreement"}
        </button>
        <p role="status" className={`font-bold ${publish.isError ? "text-rust-700" : "text-lichen-700"}`}>
          {publish.isSuccess ? `Version ${publish.data.version} published. Volunteers will be asked to accept it.` : publish.isError && !(publish.error instanceof ApiError && Object.keys(publish.error.fields).length) ? publish.error.message : ""}
        </p>
      </form>
      {versions.data.versions.length > 0 && (
        <section aria-labelledby="versions-heading">
          <h2 id="versions-heading" className="mb-2 text-xl font-bold">Versions</h2>
          <table className="w-full border-collapse bg-white text-left">
            <thead>
              <tr className="border-b border-shingle-200">
                <th scope="col" className="p-2">Version</th>
                <th scope="col" className="p-2">Licence</th>
                <th scope="col" className="p-2">Written</th>
                <th scope="col" className="p-2">Accepted by</th>
              </tr>
            </thead>
            <tbody>
              {versions.data.versions.map((v) => (
                <tr key={v.version} className="border-b border-shingle-100">
                  <th scope="row" className="p-2">{v.version}</th>
                  <td className="p-2">{v.licence}</td>
                  <td className="p-2">{v.createdAt.slice(0, 10)}{v.createdBy ? `, ${v.createdBy}` : ""}</td>
                  <td className="p-2">{v.accepted} {v.accepted === 1 ? "person" : "people"}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-2"><Link href="/network/history?entity=agreement" className="font-bold text-tideline-700">History of the agreement</Link></p>
        </section>
      )}
    </>
  );
}
