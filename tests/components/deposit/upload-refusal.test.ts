import { describe, expect, it } from "vitest";
import { isRefusal, isRefusalMessage, markRefusal, REFUSED_UPLOAD, uploadLogger, withoutRefusalNotices } from "@/components/deposit/upload-refusal";

const json422 = { status: 422, responseText: '{"error":{"code":"invalid_spec","message":"The specification has 1 problem."}}' };

describe("refused uploads", () => {
  it("are answers other than 2xx whose body is JSON", () => {
    expect(isRefusal(json422)).toBe(true);
    expect(isRefusal({ status: 413, responseText: '{"error":{"code":"too_large","message":"x"}}' })).toBe(true);
    // An answer that is not ours (a proxy's HTML page) and no answer at all stay Uppy's errors.
    expect(isRefusal({ status: 502, responseText: "<html>Bad gateway</html>" })).toBe(false);
    expect(isRefusal({ status: 0, responseText: "" })).toBe(false);
    expect(isRefusal({ status: 201, responseText: "{}" })).toBe(false);
  });

  it("are marked with an error before xhr-upload's status check, and only they", () => {
    expect(() => markRefusal(json422)).toThrow(REFUSED_UPLOAD);
    expect(() => markRefusal({ status: 201, responseText: '{"status":"created"}' })).not.toThrow();
  });

  it("are not logged to the console; other errors are", () => {
    const logged: unknown[][] = [];
    const logger = uploadLogger((...args) => logged.push(args));
    logger.error(REFUSED_UPLOAD);
    logger.error(`Failed to upload x.json ${REFUSED_UPLOAD}`);
    expect(logged).toEqual([]);
    logger.error("This looks like a network error");
    expect(logged).toEqual([["[Uppy]", "This looks like a network error"]]);
    logger.warn("w");
    logger.debug("d");
    expect(logged.length).toBe(1);
  });

  it("take out only Uppy's notice about the refusal", () => {
    const info = [
      { type: "error", message: "You can only upload: .json", details: null },
      { type: "error", message: "Failed to upload x.json", details: REFUSED_UPLOAD },
    ];
    expect(withoutRefusalNotices(info)).toEqual([info[0]]);
    expect(isRefusalMessage(undefined)).toBe(false);
  });
});
