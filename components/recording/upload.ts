// The browser's side of a recording upload: ask the app for a presigned address, PUT the bytes
// straight to storage with progress, then ask the app to check what arrived.
import { ApiError, fetchJson } from "@/lib/catalogue/fetch-json";

export const MAX_RECORDING_BYTES = 25 * 1024 * 1024;

type Ticket = { uploadId: string; url: string; method: "PUT"; headers: Record<string, string> };

/** "audio/webm;codecs=opus" → "audio/webm": the parameters are not part of the type the server signs. */
export function baseType(type: string): string {
  return type.split(";")[0].trim().toLowerCase();
}

// XMLHttpRequest rather than fetch: fetch reports no upload progress (WHATWG Fetch has no upload
// progress events; XMLHttpRequest's upload.onprogress does — XMLHttpRequest Standard §3.6).
function put(ticket: Ticket, body: Blob, onProgress: (percent: number) => void): Promise<void> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(ticket.method, ticket.url);
    for (const [name, value] of Object.entries(ticket.headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(Math.round((e.loaded / e.total) * 100));
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(100);
        resolve();
      } else reject(new ApiError(xhr.status, "The recording could not be stored. Please try again."));
    };
    xhr.onerror = () => reject(new ApiError(0, "The upload was interrupted. Check your connection and try again."));
    xhr.send(body);
  });
}

export async function uploadRecording(
  body: Blob,
  target: { assignmentStudentId?: string; tuneId?: string; stageIndex: number },
  onProgress: (percent: number) => void,
): Promise<string> {
  const contentType = baseType(body.type) || "application/octet-stream";
  const ticket = await fetchJson<Ticket>("/api/recordings", {
    method: "POST",
    body: { ...target, contentType, sizeBytes: body.size },
  });
  await put(ticket, body, onProgress);
  await fetchJson(`/api/recordings/${ticket.uploadId}/complete`, { method: "POST" });
  return ticket.uploadId;
}

/** The server's words for a refusal, with the field's reason when there is one. */
export function refusalWords(error: unknown): string {
  if (!(error instanceof ApiError)) return error instanceof Error ? error.message : "Something went wrong.";
  const field = Object.values(error.fieldErrors)[0];
  return field && !error.message.includes(field) ? `${error.message} (${field})` : error.message;
}
