import { eq } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seasons, species, transectAssignments, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { createPaperWalk } from "@/lib/queries/paper-walks";
import { personDetail } from "@/lib/queries/people";
import { personalData } from "@/lib/queries/personal-data";
import { walkSourcesOf } from "@/lib/queries/person-walks";
import { reviewQueuePage } from "@/lib/queries/review-queue";
import { importSeason, previewSeasonImport } from "@/lib/queries/season-import";
import { resetToDemo } from "./support/db";

// A walk typed in from paper and a walk imported from an earlier season say where they came
// from on every list of walks: the review queue, the person's page, My walks, the data download.
async function actorOf(email: string): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, email));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

const today = () => new Date().toISOString().slice(0, 10);
let volunteer: Actor;
let paperWalkId = "";
let importedWalkDate = "";

beforeEach(async () => {
  await resetToDemo();
  volunteer = await actorOf("volunteer01@harrowmere.example");
  const checker = await actorOf("checker@harrowmere.example");
  const organiser = await actorOf("organiser@harrowmere.example");
  const [assignment] = await db().select({ transectId: transectAssignments.transectId }).from(transectAssignments).where(eq(transectAssignments.userId, volunteer.id)).limit(1);
  const [peacock] = await db().select({ id: species.id }).from(species).where(eq(species.scientificName, "Aglais io"));
  const created = await createPaperWalk(checker, {
    volunteerId: volunteer.id, transectId: assignment!.transectId, visitDate: "2026-06-20", startTime: "10:30", endTime: null,
    temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, sunshinePercent: null, rain: null, completeList: "yes", notes: null,
    sightings: [{ speciesId: peacock!.id, count: 3, section: null }],
  });
  paperWalkId = created.visitId;

  const [season] = await db().insert(seasons).values({ name: "2024 season", startsOn: "2024-04-01", endsOn: "2024-09-30", status: "closed", closedAt: new Date("2024-10-01T00:00:00Z") }).returning();
  importedWalkDate = "2024-05-14";
  const input = {
    seasonId: season!.id,
    recordStatus: "pending" as const,
    walks: { fileName: "walks-2024.csv", bytes: Buffer.from(`walk_ref,transect_code,date,start_time,complete_list,recorder\nA1,CHK-01,${importedWalkDate},10:30,yes,${volunteer.email}\n`) },
    sightings: { fileName: "sightings-2024.csv", bytes: Buffer.from("walk_ref,species,count\nA1,Aglais io,2\n") },
  };
  const preview = await previewSeasonImport(input);
  await importSeason(organiser, { ...input, previewHash: preview.previewHash! });
});

describe("where a walk came from", () => {
  it("is on the review queue's rows: entered by the reviewer, or imported from the file", async () => {
    const queue = (await reviewQueuePage({ status: "waiting", sort: "date", dir: "desc", page: 1, pageSize: 100, volunteer: volunteer.id })).rows;
    const paper = queue.find((r) => r.walk.date === "2026-06-20" && r.walk.enteredBy !== null);
    expect(paper).toMatchObject({ volunteer: { name: volunteer.name }, walk: { enteredBy: "Priya Coldharbour", importedFrom: null } });
    const imported = (await reviewQueuePage({ status: "waiting", sort: "date", dir: "desc", page: 1, pageSize: 100, from: importedWalkDate, to: importedWalkDate })).rows;
    expect(imported.find((r) => r.walk.importedFrom !== null)!.walk.importedFrom).toBe(`imported from walks-2024.csv on ${today()}`);
  });

  it("is on the person's walks this season and in My walks", async () => {
    const detail = await personDetail(volunteer.id);
    expect(detail.walks.find((w) => w.id === paperWalkId)).toMatchObject({ enteredBy: "Priya Coldharbour", importedFrom: null });
    const sources = await walkSourcesOf(volunteer.id);
    expect(sources[paperWalkId]).toBe(`recorded by ${volunteer.name}, entered by Priya Coldharbour`);
    expect(Object.values(sources)).toContain(`imported from walks-2024.csv on ${today()}`);
    expect(Object.keys(sources)).toHaveLength(2);
  });

  it("is in the person's data download", async () => {
    const data = await personalData(volunteer.id);
    const walks = data.walks as { id: string; date: string; enteredBy: string | null; importedFrom: string | null }[];
    expect(walks.find((w) => w.id === paperWalkId)!.enteredBy).toBe("Priya Coldharbour");
    expect(walks.find((w) => w.date === importedWalkDate)!.importedFrom).toBe(`imported from walks-2024.csv on ${today()}`);
  });
});
