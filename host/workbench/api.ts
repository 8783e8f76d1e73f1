/**
 * The one typed host interface both shells implement: Electron's main process over IPC and
 * the browser mode's local HTTP bridge. The renderer calls `HostClient.call(method, request)`
 * and never learns which shell answered. Every request and every response is checked
 * against the zod schema below on the host side, so nothing unvalidated crosses the bridge.
 *
 * Errors are values: a method answers `{ ok: false, error }` with a located error, never a
 * thrown exception across the bridge.
 */
import { z } from 'zod';

/** Largest breath file or report accepted across the bridge (bytes of text / base64). */
export const MAX_FILE_CHARS = 40_000_000;

const fileName = z
  .string()
  .min(1)
  .max(200)
  .refine((name) => !/[\\/\0]/.test(name) && name !== '.' && name !== '..', 'a plain file name without folders');

/**
 * A file as the user chose or dropped it: its name and its exact bytes, base64-encoded, so an
 * export in any encoding reaches the importer unchanged.
 */
export const filePayload = z.object({ name: fileName, base64: z.string().max(MAX_FILE_CHARS).regex(/^[A-Za-z0-9+/]*={0,2}$/, 'base64 text') });
export type FilePayload = z.infer<typeof filePayload>;

/** Case ids are made by the host: date, time and a random suffix. */
export const caseId = z.string().regex(/^case-[0-9]{8}-[0-9]{6}-[0-9a-f]{6}$/, 'a case id made by Twofold');

export const caseSummary = z.object({
  caseId,
  title: z.string().max(200),
  savedAt: z.string(),
  day1Name: z.string(),
  day2Name: z.string(),
});
export type CaseSummary = z.infer<typeof caseSummary>;

export const signerInfo = z.object({
  id: z.string().regex(/^[a-z0-9-]{1,60}$/),
  label: z.string(),
  /** True for the built-in demonstration certificate: reports signed with it say so. */
  demonstration: z.boolean(),
  /**
   * True when signing needs the certificate's password and the workbench does not hold it:
   * the password is asked for and kept in the host's memory only while the workbench is open.
   */
  needsPassword: z.boolean(),
});
export type SignerInfo = z.infer<typeof signerInfo>;

export const bridgeError = z.object({
  code: z.string(),
  file: z.string(),
  line: z.number().int().nullable(),
  column: z.number().int().nullable(),
  message: z.string(),
});
export type BridgeError = z.infer<typeof bridgeError>;

/** What the lab records beside the breath file (Borg RPE at peak, lactate, spirometry, resting HR). */
export const clinicalInputs = z.object({
  peakRpe: z.number().min(6).max(20).nullable(),
  lactateMmolL: z.number().min(0).max(40).nullable(),
  fev1L: z.number().min(0.2).max(9).nullable(),
  mvvLMin: z.number().min(5).max(400).nullable(),
  restingHrBpm: z.number().min(20).max(200).nullable(),
});

/** The methods, each with its request and response schema. */
export const HOST_METHODS = {
  /** The demo pair shipped in sample-tests/demo (the declining pair). */
  demoPair: {
    request: z.object({}),
    /** `existingCaseId`: a saved case of this very pair (same title and files), to reopen instead of copying again. */
    response: z.object({ day1: filePayload, day2: filePayload, title: z.string(), existingCaseId: caseId.nullable() }),
  },
  /** Makes a new case (core's `newCase`, default settings) and copies both files into its folder. */
  createCase: {
    request: z.object({
      title: z.string().min(1).max(200),
      day1: filePayload,
      day2: filePayload,
      clinical: z.object({ day1: clinicalInputs, day2: clinicalInputs }),
    }),
    response: caseSummary,
  },
  /** The case's two files and its case file, checked (schema, hash chain, raw copies). */
  openCase: {
    request: z.object({ caseId }),
    response: z.object({ summary: caseSummary, day1: filePayload, day2: filePayload, caseJson: z.string() }),
  },
  /**
   * Removes a just-made case whose files could not be analysed, so a failed try leaves no
   * case behind. Refused (and the case kept) once it has reviewer log entries or reports.
   */
  discardCase: {
    request: z.object({ caseId }),
    response: z.object({ discarded: z.literal(true) }),
  },
  /** Atomic save of the case file (write a temporary file, flush, rename). */
  saveCase: {
    request: z.object({ caseId, caseJson: z.string().min(2).max(MAX_FILE_CHARS) }),
    response: z.object({ savedAt: z.string(), bytes: z.number().int() }),
  },
  listCases: {
    request: z.object({}),
    response: z.object({ cases: z.array(caseSummary) }),
  },
  /** Remembered column mappings, one per export layout (the importer's mapping file format). */
  listMappings: {
    request: z.object({}),
    response: z.object({ mappings: z.array(z.object({ layoutKey: z.string(), mappingJson: z.string() })) }),
  },
  saveMapping: {
    request: z.object({ layoutKey: z.string().regex(/^[A-Za-z0-9_-]{1,128}$/), mappingJson: z.string().max(100_000) }),
    response: z.object({ saved: z.literal(true) }),
  },
  listSigners: {
    request: z.object({}),
    response: z.object({ signers: z.array(signerInfo) }),
  },
  /** The report as it would be exported, unsigned and not kept: for the preview. */
  previewReport: {
    // locale: the workbench's number and date format (core/locale/); absent keeps the case's.
    request: z.object({ caseId, reviewer: z.string().max(200), locale: z.string().max(35).optional() }),
    response: z.object({ base64: z.string() }),
  },
  /** Builds the report from the saved case, signs it, writes it into the case folder. */
  exportReport: {
    // password: the lab certificate's, when the host does not hold it yet (listSigners says);
    // kept in memory only, never written.
    request: z.object({ caseId, signerId: signerInfo.shape.id, reviewer: z.string().min(1).max(200), locale: z.string().max(35).optional(), password: z.string().min(1).max(1024).optional() }),
    response: z.object({ fileName: z.string(), path: z.string(), bytes: z.number().int(), demonstration: z.boolean() }),
  },
  /** Checks a signed report: either one in a case folder, or bytes the user chose. */
  verifyReport: {
    request: z.union([
      z.object({ caseId, fileName }),
      z.object({ fileName, base64: z.string().max(MAX_FILE_CHARS) }),
    ]),
    response: z.object({
      valid: z.boolean(),
      summary: z.string(),
      checks: z.array(z.object({ name: z.string(), passed: z.boolean(), detail: z.string() })),
    }),
  },
} as const;

export type HostMethod = keyof typeof HOST_METHODS;
export type HostRequest<M extends HostMethod> = z.infer<(typeof HOST_METHODS)[M]['request']>;
export type HostResponse<M extends HostMethod> = z.infer<(typeof HOST_METHODS)[M]['response']>;
export type HostReply<M extends HostMethod> =
  | { readonly ok: true; readonly value: HostResponse<M> }
  | { readonly ok: false; readonly error: BridgeError };

/** What a shell implements: one async function per method. */
export type HostService = { readonly [M in HostMethod]: (request: HostRequest<M>) => Promise<HostReply<M>> };

/** What the renderer holds: a single entry point, plus the shell's menu commands. */
export interface HostClient {
  call<M extends HostMethod>(method: M, request: HostRequest<M>): Promise<HostReply<M>>;
  /** Called when the shell's own menu asks for a command by id (Electron); browser mode never calls it. */
  onCommand(listener: (commandId: string) => void): () => void;
}

export function isHostMethod(name: string): name is HostMethod {
  return Object.prototype.hasOwnProperty.call(HOST_METHODS, name);
}

/** An error about the bridge itself (bad request), in the located form the renderer shows. */
export function bridgeFailure(code: string, message: string, file = 'request'): { ok: false; error: BridgeError } {
  return { ok: false, error: { code, file, line: null, column: null, message } };
}

/**
 * Validates a request, runs the method, validates the answer. Both shells go through here,
 * so their checks cannot drift apart.
 */
export async function dispatch(service: HostService, method: string, request: unknown): Promise<HostReply<HostMethod>> {
  if (!isHostMethod(method)) return bridgeFailure('unknown-method', `Twofold has no host action called '${method}'.`);
  const spec = HOST_METHODS[method];
  const parsed = spec.request.safeParse(request ?? {});
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const where = issue && issue.path.length > 0 ? ` (${issue.path.join('.')})` : '';
    return bridgeFailure('bad-request', `The request to '${method}' was not valid${where}: ${issue?.message ?? 'unknown problem'}.`);
  }
  const run = service[method] as (r: unknown) => Promise<HostReply<HostMethod>>;
  let reply: HostReply<HostMethod>;
  try {
    reply = await run(parsed.data);
  } catch (error) {
    return bridgeFailure('host-failure', `The host could not finish '${method}': ${error instanceof Error ? error.message : String(error)}`);
  }
  if (!reply.ok) return { ok: false, error: bridgeError.parse(reply.error) };
  const checked = spec.response.safeParse(reply.value);
  if (!checked.success) return bridgeFailure('bad-response', `The host gave a malformed answer to '${method}'.`);
  return { ok: true, value: checked.data } as HostReply<HostMethod>;
}
