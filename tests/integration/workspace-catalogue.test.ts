import { randomUUID } from "node:crypto";
import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import { and, eq } from "drizzle-orm";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { createInstrument, updateInstrument } from "@/app/(workspace)/workspace/instruments/actions";
import { createProtocol, reviseProtocol } from "@/app/(workspace)/workspace/protocols/actions";
import { addToolPhoto, createTool, deleteToolPhoto, updateTool } from "@/app/(workspace)/workspace/tools/actions";
import { GET as getToolPhoto } from "@/app/api/tool-photos/[photoId]/[width]/route";
import { db } from "@/db";
import { insertToolPhoto } from "@/db/queries/tool-photos";
import { instruments, labMembers, labs, makers, protocols, protocolVersions, toolPhotos, tools } from "@/db/schema";
import { idleActionState } from "@/lib/action-state";
import { getObjectStorageClient, objectStorageBucket } from "@/lib/object-storage";
import { defaultSafetyCautions } from "@/lib/validations/protocol";
import { form, redirectOf, type ServerAction } from "../support/actions";
import { createAccount } from "../support/factories";
import { actAs } from "../support/session-mock";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn(), updateTag: vi.fn() }));
// The real insert, replaceable per test to simulate the database failing after the objects were stored.
vi.mock("@/db/queries/tool-photos", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/db/queries/tool-photos")>();
  return { ...actual, insertToolPhoto: vi.fn(actual.insertToolPhoto) };
});

type Account = Awaited<ReturnType<typeof createAccount>>;

async function expectRefusedToOutsiders(action: ServerAction, formData: () => FormData) {
  actAs(null);
  expect((await action(idleActionState, formData())).status).toBe("unauthenticated");
  actAs(await createAccount({ role: "reader" }));
  expect((await action(idleActionState, formData())).status).toBe("forbidden");
  actAs(await createAccount({ role: "admin" }));
  expect((await action(idleActionState, formData())).status).toBe("forbidden");
}

async function objectKeysUnder(prefix: string): Promise<string[]> {
  const listed = await getObjectStorageClient().send(new ListObjectsV2Command({ Bucket: objectStorageBucket(), Prefix: prefix }));
  return (listed.Contents ?? []).map((object) => object.Key!).sort();
}

const unique = () => randomUUID().slice(0, 8);

let makerId: string;
let reviewer: Account;
let otherReviewer: Account;
let editor: Account;

beforeAll(async () => {
  const [maker] = await db
    .insert(makers)
    .values({ slug: `test-maker-${unique()}`, name: `Test Maker ${unique()}`, country: "Nowhere" })
    .returning({ id: makers.id });
  makerId = maker!.id;
  reviewer = await createAccount({ role: "reviewer" });
  otherReviewer = await createAccount({ role: "reviewer" });
  editor = await createAccount({ role: "editor" });
});

afterAll(() => actAs(null));

function toolFields(overrides: Record<string, string> = {}): Record<string, string> {
  return {
    makerId,
    model: `Calor ${unique()}`,
    category: "hot_air_station",
    applianceType: "heating",
    ratedPowerW: "700",
    ratedVoltageMin: "230",
    ratedVoltageMax: "",
    ratedFrequency: "50/60",
    ratedAirflowLpm: "110",
    temperatureMinC: "100",
    temperatureMaxC: "480",
    claimedHeatUpSeconds: "25",
    price: "149.50",
    currency: "eur",
    "accessories.0.kind": "nozzle",
    "accessories.0.name": "Round nozzle",
    "accessories.0.size": "6 mm",
    summary: "A test station.",
    ...overrides,
  };
}

async function createTestTool(fields: Record<string, string> = {}) {
  actAs(reviewer);
  const location = await redirectOf(createTool, form(toolFields(fields)));
  const slug = /^\/workspace\/tools\/([a-z0-9-]+)\/edit/.exec(location)?.[1];
  expect(slug, location).toBeDefined();
  const [row] = await db.select().from(tools).where(eq(tools.slug, slug!));
  return row!;
}

describe("tools", () => {
  it("a reviewer adds a tool: slug from maker and model, numbers and currency normalised", async () => {
    const model = `Calor ${unique()}`;
    const tool = await createTestTool({ model });
    const [maker] = await db.select({ name: makers.name }).from(makers).where(eq(makers.id, makerId));
    expect(tool.slug).toBe(`${maker!.name} ${model}`.toLowerCase().replace(/[^a-z0-9]+/g, "-"));
    expect(tool).toMatchObject({
      ratedVoltageMin: 230,
      ratedVoltageMax: 230,
      ratedFrequenciesHz: [50, 60],
      priceMinor: 14950,
      currency: "EUR",
      motorShareAboveHalf: null,
      accessories: [{ kind: "nozzle", name: "Round nozzle", size: "6 mm" }],
    });
  });

  it("gives a second tool of the same name its own slug", async () => {
    const model = `Twin ${unique()}`;
    const first = await createTestTool({ model });
    const second = await createTestTool({ model });
    expect(second.slug).toBe(`${first.slug}-2`);
  });

  it("creates a maker typed in as new, and reuses it when typed again", async () => {
    const name = `Fresh Maker ${unique()}`;
    const first = await createTestTool({ makerId: "new", newMakerName: name, newMakerCountry: "Iceland" });
    const second = await createTestTool({ makerId: "new", newMakerName: name, newMakerCountry: "Iceland" });
    expect(second.makerId).toBe(first.makerId);
    const [maker] = await db.select().from(makers).where(eq(makers.id, first.makerId));
    expect(maker).toMatchObject({ name, country: "Iceland" });
  });

  it("names every invalid field beside it and writes nothing", async () => {
    actAs(reviewer);
    const model = `Broken ${unique()}`;
    const result = await createTool(
      idleActionState,
      form(
        toolFields({
          model,
          ratedPowerW: "-5",
          ratedVoltageMin: "240",
          ratedVoltageMax: "220",
          temperatureMinC: "400",
          temperatureMaxC: "300",
          currency: "EURO",
          applianceType: "heating",
          motorShare: "above",
          "accessories.0.name": "",
        }),
      ),
    );
    expect(result.status).toBe("error");
    expect(result.fieldErrors).toMatchObject({
      ratedPowerW: ["Rated power input must be above 0 W."],
      ratedVoltageMax: ["The upper end of the voltage range cannot be below the lower end."],
      temperatureMaxC: ["The highest temperature must be above the lowest."],
      currency: ["Use a three-letter ISO 4217 currency code such as EUR, USD or GBP."],
      motorShare: ["The motor's share applies to combined appliances only."],
      "accessories.0.name": ["Name the accessory, or remove the row."],
    });
    expect(result.values?.model).toBe(model);
    expect(await db.select({ id: tools.id }).from(tools).where(eq(tools.model, model))).toEqual([]);
  });

  it("asks for the new maker's name and country, and for a currency with a price", async () => {
    actAs(reviewer);
    const result = await createTool(idleActionState, form(toolFields({ makerId: "new", currency: "" })));
    expect(result.fieldErrors).toMatchObject({
      newMakerName: ["Enter the new maker's name."],
      newMakerCountry: ["Enter the country the maker is based in."],
      currency: ["Give the currency of the price, e.g. EUR."],
    });
  });

  it("refuses readers, admins and anonymous visitors", async () => {
    await expectRefusedToOutsiders(createTool, () => form(toolFields()));
    const tool = await createTestTool();
    await expectRefusedToOutsiders(updateTool, () => form(toolFields({ slug: tool.slug, model: "Hijacked" })));
    const [after] = await db.select({ model: tools.model }).from(tools).where(eq(tools.id, tool.id));
    expect(after!.model).toBe(tool.model);
  });

  it("an editor updates the ratings; the slug stays so links keep working", async () => {
    const tool = await createTestTool();
    actAs(editor);
    const result = await updateTool(
      idleActionState,
      form(toolFields({ slug: tool.slug, model: "Renamed 9000", applianceType: "combined", motorShare: "above", ratedVoltageMax: "240", ratedVoltageMin: "220" })),
    );
    expect(result).toMatchObject({ status: "ok" });
    const [after] = await db.select().from(tools).where(eq(tools.id, tool.id));
    expect(after).toMatchObject({ slug: tool.slug, model: "Renamed 9000", applianceType: "combined", motorShareAboveHalf: true, ratedVoltageMin: 220, ratedVoltageMax: 240 });
  });
});

async function photoWithCameraData(width: number, height: number): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: "#2c6e68" } })
    .jpeg()
    .withMetadata({ exif: { IFD0: { Artist: "Someone Private", Make: "Pocket Camera" } } })
    .toBuffer();
}

const photoFile = (bytes: Buffer, name = "bench.jpg") => new File([new Uint8Array(bytes)], name, { type: "image/jpeg" });

describe("tool photos", () => {
  it("stores WebP renditions at web widths without metadata, serves them, and deletes row and objects together", async () => {
    const tool = await createTestTool();
    const original = await photoWithCameraData(2000, 1500);
    expect((await sharp(original).metadata()).exif).toBeDefined();

    actAs(reviewer);
    const added = await addToolPhoto(idleActionState, form({ slug: tool.slug, altText: "Station front panel, handle in its cradle", photo: photoFile(original) }));
    expect(added).toMatchObject({ status: "ok" });
    const [photo] = await db.select().from(toolPhotos).where(eq(toolPhotos.toolId, tool.id));
    expect(photo).toMatchObject({ widths: [480, 960, 1600], heights: [360, 720, 1200], objectKeyPrefix: `tools/${tool.id}/${photo!.id}` });
    expect(await objectKeysUnder(`tools/${tool.id}/`)).toEqual([480, 960, 1600].map((width) => `tools/${tool.id}/${photo!.id}/${width}.webp`).sort());

    const response = await getToolPhoto(new Request("http://localhost/api/tool-photos"), {
      params: Promise.resolve({ photoId: photo!.id, width: "960" }),
    } as RouteContext<"/api/tool-photos/[photoId]/[width]">);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("image/webp");
    expect(response.headers.get("cache-control")).toContain("immutable");
    const served = await sharp(Buffer.from(await response.arrayBuffer())).metadata();
    expect(served).toMatchObject({ format: "webp", width: 960, height: 720 });
    expect(served.exif).toBeUndefined();

    actAs(otherReviewer);
    const deleted = await deleteToolPhoto(idleActionState, form({ slug: tool.slug, photoId: photo!.id }));
    expect(deleted).toMatchObject({ status: "ok" });
    expect(await db.select().from(toolPhotos).where(eq(toolPhotos.id, photo!.id))).toEqual([]);
    expect(await objectKeysUnder(`tools/${tool.id}/`)).toEqual([]);
  });

  it("never enlarges a small photo", async () => {
    const tool = await createTestTool();
    actAs(reviewer);
    const small = await photoWithCameraData(300, 200);
    expect(await addToolPhoto(idleActionState, form({ slug: tool.slug, altText: "A small close-up of the nozzle", photo: photoFile(small) }))).toMatchObject({ status: "ok" });
    const [photo] = await db.select().from(toolPhotos).where(eq(toolPhotos.toolId, tool.id));
    expect(photo).toMatchObject({ widths: [300], heights: [200] });
  });

  it("requires alt text and an image, and stores nothing otherwise", async () => {
    const tool = await createTestTool();
    actAs(reviewer);
    const noAlt = await addToolPhoto(idleActionState, form({ slug: tool.slug, altText: " ", photo: photoFile(await photoWithCameraData(800, 600)) }));
    expect(noAlt.fieldErrors?.altText).toEqual(["Describe the photo for readers who cannot see it."]);
    const notImage = await addToolPhoto(idleActionState, form({ slug: tool.slug, altText: "Rear panel with the fuse holder", photo: photoFile(Buffer.from("not a picture")) }));
    expect(notImage.fieldErrors?.photo).toEqual(["That file could not be read as an image."]);
    expect(await db.select().from(toolPhotos).where(eq(toolPhotos.toolId, tool.id))).toEqual([]);
    expect(await objectKeysUnder(`tools/${tool.id}/`)).toEqual([]);
  });

  it("leaves neither row nor objects when the row write fails after the upload", async () => {
    const tool = await createTestTool();
    actAs(reviewer);
    vi.mocked(insertToolPhoto).mockRejectedValueOnce(new Error("database went away"));
    await expect(
      addToolPhoto(idleActionState, form({ slug: tool.slug, altText: "Station front panel, handle in its cradle", photo: photoFile(await photoWithCameraData(1000, 800)) })),
    ).rejects.toThrow("database went away");
    expect(await db.select().from(toolPhotos).where(eq(toolPhotos.toolId, tool.id))).toEqual([]);
    expect(await objectKeysUnder(`tools/${tool.id}/`)).toEqual([]);
  });

  it("refuses outsiders, and serves nothing for an unknown photo or width", async () => {
    const tool = await createTestTool();
    await expectRefusedToOutsiders(addToolPhoto, () => form({ slug: tool.slug, altText: "Station front panel", photo: new File(["x"], "x.jpg", { type: "image/jpeg" }) }));
    await expectRefusedToOutsiders(deleteToolPhoto, () => form({ slug: tool.slug, photoId: randomUUID() }));
    const call = (photoId: string, width: string) =>
      getToolPhoto(new Request("http://localhost/api/tool-photos"), { params: Promise.resolve({ photoId, width }) } as RouteContext<"/api/tool-photos/[photoId]/[width]">);
    expect((await call(randomUUID(), "480")).status).toBe(404);
    expect((await call("not-a-uuid", "480")).status).toBe(422);
  });
});

describe("instruments register", () => {
  let labId: string;
  let otherLabId: string;

  beforeAll(async () => {
    const [lab, otherLab] = await db
      .insert(labs)
      .values([
        { slug: `test-lab-${unique()}`, name: "Test Lab", city: "Testford", nominalVoltage: 230, frequencyHz: 50 },
        { slug: `test-lab-${unique()}`, name: "Other Lab", city: "Elsewhere", nominalVoltage: 120, frequencyHz: 60 },
      ])
      .returning({ id: labs.id });
    labId = lab!.id;
    otherLabId = otherLab!.id;
    await db.insert(labMembers).values([
      { labId, userId: reviewer.id },
      { labId: otherLabId, userId: otherReviewer.id },
    ]);
  });

  const instrumentFields = (overrides: Record<string, string> = {}) => ({
    kind: "current_clamp",
    maker: "Test Clamps",
    model: "TC-1",
    serialNumber: `SN-${unique()}`,
    labId,
    "accuracy.0.quantity": "current",
    "accuracy.0.unit": "A",
    "accuracy.0.rangeMax": "40",
    "accuracy.0.spec": "±(1.5% + 0.05)",
    calibratedOn: "2026-01-15",
    calibrationDueOn: "2027-01-15",
    ...overrides,
  });

  it("a reviewer registers an instrument in their lab, the accuracy parsed into its terms", async () => {
    actAs(reviewer);
    const fields = instrumentFields();
    expect(await redirectOf(createInstrument, form(fields))).toBe("/workspace/instruments?saved=1");
    const [row] = await db.select().from(instruments).where(eq(instruments.serialNumber, fields.serialNumber));
    expect(row).toMatchObject({
      labId,
      createdById: reviewer.id,
      accuracy: [{ quantity: "current", unit: "A", rangeMax: 40, percentOfReading: 1.5, offset: 0.05 }],
      calibratedOn: "2026-01-15",
      calibrationDueOn: "2027-01-15",
    });
  });

  it("names invalid accuracy lines and dates, and writes nothing", async () => {
    actAs(reviewer);
    const fields = instrumentFields({ "accuracy.0.spec": "1.5 A", "accuracy.0.rangeMax": "0", calibrationDueOn: "2025-12-01", kind: "flux_capacitor" });
    const result = await createInstrument(idleActionState, form(fields));
    expect(result.fieldErrors?.kind).toEqual(["Choose what kind of instrument this is."]);
    expect(result.fieldErrors?.["accuracy.0.spec"]?.[0]).toMatch(/"1.5 A" is not a plain number or percentage/);
    expect(result.fieldErrors?.["accuracy.0.rangeMax"]).toEqual(["The top of the range must be above 0."]);
    expect(result.fieldErrors?.calibrationDueOn).toEqual(["The due date must come after the calibration date."]);
    const noRows = await createInstrument(idleActionState, form({ ...instrumentFields(), "accuracy.0.quantity": "", "accuracy.0.unit": "", "accuracy.0.rangeMax": "", "accuracy.0.spec": "" }));
    expect(noRows.fieldErrors?.["accuracy.0.spec"]).toBeDefined();
    expect(await db.select().from(instruments).where(eq(instruments.serialNumber, fields.serialNumber))).toEqual([]);
  });

  it("refuses a second entry with the same maker, model and serial", async () => {
    actAs(reviewer);
    const fields = instrumentFields();
    await redirectOf(createInstrument, form(fields));
    const again = await createInstrument(idleActionState, form(fields));
    expect(again.fieldErrors?.serialNumber).toEqual(["An instrument with this maker, model and serial number is already in the register."]);
  });

  it("keeps a reviewer to their own lab's register; an editor keeps all", async () => {
    actAs(reviewer);
    const elsewhere = await createInstrument(idleActionState, form(instrumentFields({ labId: otherLabId })));
    expect(elsewhere.fieldErrors?.labId).toEqual(["Choose one of your labs."]);

    const fields = instrumentFields();
    await redirectOf(createInstrument, form(fields));
    const [row] = await db.select({ id: instruments.id }).from(instruments).where(eq(instruments.serialNumber, fields.serialNumber));

    actAs(otherReviewer);
    const refused = await updateInstrument(idleActionState, form({ ...fields, id: row!.id, model: "TC-1 tampered", labId: "" }));
    expect(refused).toMatchObject({ status: "error", message: "That instrument is not in a register you keep." });

    actAs(editor);
    expect(await redirectOf(updateInstrument, form({ ...fields, id: row!.id, calibratedOn: "2026-02-01", calibrationDueOn: "2027-02-01" }))).toBe("/workspace/instruments?saved=1");
    const [after] = await db.select().from(instruments).where(eq(instruments.id, row!.id));
    expect(after).toMatchObject({ model: "TC-1", calibratedOn: "2026-02-01", calibrationDueOn: "2027-02-01" });
  });

  it("refuses readers, admins and anonymous visitors", async () => {
    await expectRefusedToOutsiders(createInstrument, () => form(instrumentFields()));
    await expectRefusedToOutsiders(updateInstrument, () => form({ ...instrumentFields(), id: randomUUID() }));
  });
});

describe("test protocols", () => {
  const protocolFields = (overrides: Record<string, string> = {}) => ({
    name: `Bench protocol ${unique()}`,
    summary: "Power input and airflow of a hot-air station.",
    supplyVoltage: "230",
    supplyFrequencyHz: "50",
    ambientC: "23",
    nozzle: "6 mm round",
    airflowSetpoint: "Maximum",
    temperatureSetpointC: "350",
    measuringDistanceMm: "10",
    warmUpMinutes: "5",
    repeats: "3",
    "requiredMeasurements.power_input_full_demand": "on",
    "requiredMeasurements.airflow": "on",
    airflowToleranceKind: "percent",
    airflowTolerancePlus: "10",
    airflowToleranceMinus: "10",
    airflowToleranceSource: "Maker's datasheet",
    stepsMdx: "## Set-up\n\n1. Fit the nozzle.",
    safetyCautions: defaultSafetyCautions,
    ...overrides,
  });

  async function createTestProtocol(author: Account) {
    actAs(author);
    const fields = protocolFields();
    const location = await redirectOf(createProtocol, form(fields));
    const slug = /^\/workspace\/protocols\/([a-z0-9-]+)$/.exec(location)?.[1];
    expect(slug, location).toBeDefined();
    const [protocol] = await db.select().from(protocols).where(eq(protocols.slug, slug!));
    return { protocol: protocol!, fields };
  }

  it("creating a protocol writes version 1 with its conditions, measurements and tolerances", async () => {
    const { protocol } = await createTestProtocol(reviewer);
    const [version] = await db.select().from(protocolVersions).where(eq(protocolVersions.protocolId, protocol.id));
    expect(version).toMatchObject({
      version: 1,
      createdById: reviewer.id,
      repeats: 3,
      requiredMeasurements: ["power_input_full_demand", "airflow"],
      conditions: { supplyVoltage: 230, supplyFrequencyHz: 50, ambientC: 23, nozzle: "6 mm round", temperatureSetpointC: 350, measuringDistanceMm: 10, warmUpMinutes: 5 },
      tolerances: { airflow: { kind: "percent", plus: 10, minus: 10, source: "Maker's datasheet" } },
    });
  });

  it("names invalid fields and writes nothing", async () => {
    actAs(reviewer);
    const name = `Broken protocol ${unique()}`;
    const result = await createProtocol(
      idleActionState,
      form(protocolFields({ name, supplyVoltage: "400", "requiredMeasurements.power_input_full_demand": "", "requiredMeasurements.airflow": "", airflowToleranceMinus: "", airflowToleranceSource: "", stepsMdx: "" })),
    );
    expect(result.fieldErrors).toMatchObject({
      supplyVoltage: ["Mains supply between 90 and 260 V."],
      requiredMeasurements: ["Tick at least one measurement the protocol requires."],
      airflowToleranceMinus: ["Give the lower tolerance, or set the tolerance to not set."],
      airflowToleranceSource: ["Say where the tolerance comes from (a standard, the maker, the protocol's own choice)."],
      stepsMdx: ["Write the steps, in MDX."],
    });
    expect(await db.select().from(protocols).where(eq(protocols.name, name))).toEqual([]);
  });

  it("a revision appends version N + 1 and leaves version N exactly as it was", async () => {
    const { protocol, fields } = await createTestProtocol(reviewer);
    const [before] = await db.select().from(protocolVersions).where(eq(protocolVersions.protocolId, protocol.id));

    actAs(reviewer);
    const location = await redirectOf(reviseProtocol, form({ ...fields, slug: protocol.slug, repeats: "5", stepsMdx: "## Set-up\n\n1. Fit the 4 mm nozzle." }));
    expect(location).toBe(`/workspace/protocols/${protocol.slug}?version=2`);
    actAs(editor);
    await redirectOf(reviseProtocol, form({ ...fields, slug: protocol.slug, repeats: "7" }));

    const versions = await db.select().from(protocolVersions).where(eq(protocolVersions.protocolId, protocol.id)).orderBy(protocolVersions.version);
    expect(versions.map((version) => [version.version, version.repeats, version.createdById])).toEqual([
      [1, 3, reviewer.id],
      [2, 5, reviewer.id],
      [3, 7, editor.id],
    ]);
    expect(versions[0]).toEqual(before);
  });

  it("only the author or an editor may revise, and a refusal appends nothing", async () => {
    const { protocol, fields } = await createTestProtocol(reviewer);
    actAs(otherReviewer);
    const refused = await reviseProtocol(idleActionState, form({ ...fields, slug: protocol.slug, repeats: "9" }));
    expect(refused).toMatchObject({ status: "error", message: "Only the protocol's author or an editor can revise it." });
    expect(await db.select().from(protocolVersions).where(eq(protocolVersions.protocolId, protocol.id))).toHaveLength(1);
  });

  it("the database itself refuses to change a stored version", async () => {
    const { protocol } = await createTestProtocol(reviewer);
    await expect(
      db.update(protocolVersions).set({ repeats: 99 }).where(and(eq(protocolVersions.protocolId, protocol.id), eq(protocolVersions.version, 1))),
    ).rejects.toThrow();
    const [version] = await db.select({ repeats: protocolVersions.repeats }).from(protocolVersions).where(eq(protocolVersions.protocolId, protocol.id));
    expect(version!.repeats).toBe(3);
  });

  it("refuses readers, admins and anonymous visitors", async () => {
    const { protocol, fields } = await createTestProtocol(reviewer);
    await expectRefusedToOutsiders(createProtocol, () => form(protocolFields()));
    await expectRefusedToOutsiders(reviseProtocol, () => form({ ...fields, slug: protocol.slug }));
    expect(await db.select().from(protocolVersions).where(eq(protocolVersions.protocolId, protocol.id))).toHaveLength(1);
  });
});
