// Renders the app icons from public/icons/icon.svg (run once after changing the mark; the PNGs are committed).
import path from "node:path";
import sharp from "sharp";

const dir = path.resolve(import.meta.dirname, "..", "public", "icons");
const svg = path.join(dir, "icon.svg");
await sharp(svg, { density: 600 }).resize(192, 192).png().toFile(path.join(dir, "icon-192.png"));
await sharp(svg, { density: 600 }).resize(512, 512).png().toFile(path.join(dir, "icon-512.png"));
// Maskable: the mark inside the safe zone on a full-bleed background.
const inner = await sharp(svg, { density: 600 }).resize(360, 360).png().toBuffer();
await sharp({ create: { width: 512, height: 512, channels: 4, background: "#155555" } })
  .composite([{ input: inner, gravity: "center" }])
  .png()
  .toFile(path.join(dir, "icon-maskable-512.png"));
console.log("icons written");
