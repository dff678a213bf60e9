"use client";
/**
 * Drag-and-drop upload with progress, on Uppy: restrictions are checked (and stated) before
 * anything is sent; the server checks them again. Each file is posted as multipart form data
 * to `endpoint`; the server's JSON answer goes to onResult, whatever its status.
 */
import Uppy, { type Restrictions } from "@uppy/core";
import Dashboard from "@uppy/react/dashboard";
import XHRUpload from "@uppy/xhr-upload";
import "@uppy/core/css/style.min.css";
import "@uppy/dashboard/css/style.min.css";
import "./uppy-theme.css";
import { useEffect, useRef, useState } from "react";
import { isRefusalMessage, markRefusal, uploadLogger, withoutRefusalNotices } from "./upload-refusal";

export interface UploadOutcome {
  fileName: string;
  status: number;
  body: unknown;
}

export interface UploadWidgetProps {
  id: string;
  endpoint: string;
  fieldName: string;
  restrictions: Partial<Restrictions>;
  /** Shown inside the drop area, before anything is chosen. */
  note: string;
  onResult: (outcome: UploadOutcome) => void;
  height?: number;
  /** The drop area's invitation, with %{browseFiles} where the file-chooser link goes. */
  dropText?: string;
}

function xhrOf(error: unknown): XMLHttpRequest | null {
  if (typeof error === "object" && error !== null && "request" in error) {
    const r = (error as { request: unknown }).request;
    if (typeof XMLHttpRequest !== "undefined" && r instanceof XMLHttpRequest) return r;
  }
  return null;
}

function parseBody(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

/** The page's theme: the html class set by the app's theme switch, else the system setting. */
function pageTheme(): "light" | "dark" | "auto" {
  const cl = document.documentElement.classList;
  if (cl.contains("theme-dark")) return "dark";
  if (cl.contains("theme-light")) return "light";
  return "auto";
}

export function UploadWidget({ id, endpoint, fieldName, restrictions, note, onResult, height = 240, dropText = "Drop files here or %{browseFiles}" }: UploadWidgetProps) {
  const onResultRef = useRef(onResult);
  onResultRef.current = onResult;
  const [theme, setTheme] = useState<"light" | "dark" | "auto">("auto");
  const [uppy] = useState(
    () =>
      new Uppy({ id, autoProceed: true, restrictions, logger: uploadLogger((...args) => console.error(...args)) }).use(XHRUpload, {
        endpoint,
        fieldName,
        formData: true,
        // The server answers in JSON for every status; a 4xx is a verdict on the file, not a glitch to retry.
        shouldRetry: () => false,
        // A refusal is explained beside the widget: mark it so it is not taken for a network error.
        onAfterResponse: (xhr) => markRefusal(xhr),
        limit: 2,
        timeout: 0,
      }),
  );

  useEffect(() => {
    setTheme(pageTheme());
    const onSuccess = (file: { name?: string } | undefined, response: { status: number; body?: unknown }) => {
      onResultRef.current({ fileName: file?.name ?? "", status: response.status, body: response.body ?? null });
    };
    const onError = (file: { name?: string } | undefined, error: unknown) => {
      const xhr = xhrOf(error);
      // Uppy has just queued its own "Failed to upload" notice; the app's message says more.
      if (error instanceof Error && isRefusalMessage(error.message)) {
        uppy.setState({ info: withoutRefusalNotices(uppy.getState().info) });
      }
      onResultRef.current({
        fileName: file?.name ?? "",
        status: xhr?.status ?? 0,
        body: xhr === null ? null : parseBody(xhr.responseText),
      });
    };
    const onComplete = (result: { failed?: unknown[] }) => {
      // A refused file is explained beside the widget, and retrying the same bytes cannot
      // help: clear at once. A finished list stays visible a moment, then makes room.
      const failed = (result.failed?.length ?? 0) > 0;
      window.setTimeout(() => uppy.clear(), failed ? 0 : 1500);
    };
    uppy.on("upload-success", onSuccess);
    uppy.on("upload-error", onError);
    uppy.on("complete", onComplete);
    return () => {
      uppy.off("upload-success", onSuccess);
      uppy.off("upload-error", onError);
      uppy.off("complete", onComplete);
    };
  }, [uppy]);

  return (
    <div data-testid={`${id}-widget`} className="rp-upload flex flex-col gap-2">
      {/* The limits, stated before anything is chosen (the widget checks them too, before sending). */}
      <p id={`${id}-limits`} className="text-sm text-ink-soft" data-testid={`${id}-limits`}>
        {note}
      </p>
      <Dashboard
        uppy={uppy}
        note={note}
        height={height}
        width="100%"
        theme={theme}
        proudlyDisplayPoweredByUppy={false}
        hideProgressDetails={false}
        showRemoveButtonAfterComplete={false}
        aria-describedby={`${id}-limits`}
        locale={{ strings: { dropPasteFiles: dropText, browseFiles: "choose from your computer" } }}
      />
    </div>
  );
}
