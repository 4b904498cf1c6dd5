// The web app manifest and its icons: what Chromium needs to offer installation.
import { afterAll, beforeAll, expect, test } from "vitest";
import { startTestServer, type TestServer } from "../helpers/server";

let server: TestServer;

beforeAll(async () => {
  server = await startTestServer({ seed: false });
});

afterAll(async () => {
  await server?.stop();
});

interface ManifestIcon {
  src: string;
  sizes: string;
  type?: string;
  purpose?: string;
}

/** Width and height from a PNG's IHDR chunk. */
function pngSize(bytes: Uint8Array): { width: number; height: number } {
  const signature = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  expect([...bytes.slice(0, 8)]).toEqual(signature);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  return { width: view.getUint32(16), height: view.getUint32(20) };
}

test("the manifest is served and names the app, its start and its icons", async () => {
  const response = await fetch(`${server.baseUrl}/manifest.webmanifest`);
  expect(response.status).toBe(200);
  expect(response.headers.get("content-type") ?? "").toMatch(/manifest\+json|json/);
  const manifest = (await response.json()) as Record<string, unknown>;
  expect(manifest.name).toBe("Equipot");
  expect(manifest.short_name).toBe("Equipot");
  expect(manifest.start_url).toBe("/");
  expect(manifest.display).toBe("standalone");
  expect(manifest.background_color).toMatch(/^#[0-9A-F]{6}$/i);
  expect(manifest.theme_color).toMatch(/^#[0-9A-F]{6}$/i);

  const icons = manifest.icons as ManifestIcon[];
  for (const size of [192, 512]) {
    const icon = icons.find((i) => i.sizes === `${size}x${size}` && i.type === "image/png");
    expect(icon, `a ${size}×${size} PNG icon`).toBeDefined();
    const image = await fetch(new URL(icon?.src ?? "", server.baseUrl));
    expect(image.status).toBe(200);
    expect(image.headers.get("content-type")).toBe("image/png");
    expect(pngSize(new Uint8Array(await image.arrayBuffer()))).toEqual({
      width: size,
      height: size,
    });
  }
  expect(icons.some((i) => i.purpose === "maskable")).toBe(true);
});

test("the page links the manifest and a favicon, and the service worker script is served", async () => {
  const html = await (await fetch(`${server.baseUrl}/`)).text();
  expect(html).toContain('rel="manifest" href="/manifest.webmanifest"');
  expect(html).toContain('rel="icon" href="/favicon.svg"');
  expect((await fetch(`${server.baseUrl}/favicon.svg`)).status).toBe(200);
  const worker = await fetch(`${server.baseUrl}/sw.js`);
  expect(worker.status).toBe(200);
  expect(worker.headers.get("content-type") ?? "").toContain("javascript");
  const script = await worker.text();
  // The app shell answers navigations, but never /api.
  expect(script).toContain("index.html");
  expect(script).toContain("api");
});
