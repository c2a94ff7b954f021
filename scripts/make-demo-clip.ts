// Records a two-second demo clip (a moving gauge needle drawn on a canvas) with Chromium's own
// MediaRecorder, so tests and the demo have a real, playable, invented video. Run once:
//   tsx scripts/make-demo-clip.ts  → seeds/media/demo-clip.webm and demo-gauge.png
import { writeFileSync } from "node:fs";
import path from "node:path";
import { chromium } from "playwright-core";

const browser = await chromium.launch({
  executablePath: "/usr/bin/chromium",
  args: [
    "--headless",
    "--no-sandbox",
    "--disable-gpu",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    "--no-first-run",
  ],
});
const page = await browser.newPage();
await page.setContent("<canvas width=320 height=240></canvas>");
// A plain string: the browser must not see the TypeScript compiler's helpers.
const base64: string = await page.evaluate(`(async () => {
  const canvas = document.querySelector("canvas");
  const ctx = canvas.getContext("2d");
  const recorder = new MediaRecorder(canvas.captureStream(15), { mimeType: "video/webm;codecs=vp8" });
  const chunks = [];
  recorder.ondataavailable = function (e) { return chunks.push(e.data); };
  const start = performance.now();
  const draw = () => {
    const t = (performance.now() - start) / 2000;
    ctx.fillStyle = "#14302a"; ctx.fillRect(0, 0, 320, 240);
    ctx.strokeStyle = "#fbeedf"; ctx.lineWidth = 6; ctx.beginPath(); ctx.arc(160, 130, 90, Math.PI, 2 * Math.PI); ctx.stroke();
    const a = Math.PI + Math.PI * Math.min(1, t) * 0.62;
    ctx.strokeStyle = "#d9822b"; ctx.beginPath(); ctx.moveTo(160, 130); ctx.lineTo(160 + 80 * Math.cos(a), 130 + 80 * Math.sin(a)); ctx.stroke();
    ctx.fillStyle = "#fbeedf"; ctx.font = "20px sans-serif"; ctx.fillText("demo gauge", 110, 200);
    if (t < 1) requestAnimationFrame(draw);
  };
  recorder.start();
  draw();
  await new Promise((r) => setTimeout(r, 2000));
  recorder.stop();
  await new Promise((r) => (recorder.onstop = r));
  const buf = await new Blob(chunks, { type: "video/webm" }).arrayBuffer();
  let s = "";
  for (const b of new Uint8Array(buf)) s += String.fromCharCode(b);
  return btoa(s);
})()`);
// A still of the same gauge, for photo evidence.
await page.setContent(`<canvas width=320 height=240></canvas><script>
  const c = document.querySelector("canvas").getContext("2d");
  c.fillStyle = "#14302a"; c.fillRect(0, 0, 320, 240);
  c.strokeStyle = "#fbeedf"; c.lineWidth = 6; c.beginPath(); c.arc(160, 130, 90, Math.PI, 2 * Math.PI); c.stroke();
  const a = Math.PI * 1.62; c.strokeStyle = "#d9822b"; c.beginPath(); c.moveTo(160, 130); c.lineTo(160 + 80 * Math.cos(a), 130 + 80 * Math.sin(a)); c.stroke();
  c.fillStyle = "#fbeedf"; c.font = "20px sans-serif"; c.fillText("demo gauge", 110, 200);
</script>`);
await page.locator("canvas").screenshot({ path: path.resolve(import.meta.dirname, "../seeds/media/demo-gauge.png") });
await browser.close();
const out = path.resolve(import.meta.dirname, "../seeds/media/demo-clip.webm");
writeFileSync(out, Buffer.from(base64, "base64"));
console.log(`wrote ${out}`);
