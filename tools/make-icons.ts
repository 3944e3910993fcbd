// Renders the app's icons (public/icons/*.png, app/apple-icon.png) from its own mark (public/icons/sward*.svg, the
// three blades of components/ui/sward-mark.tsx). Run after changing the mark:
//   npm run icons
// The maskable icon fills its square and keeps the blades inside the central safe circle (80 % of
// the width), so a launcher may crop it to any shape.
import path from "node:path";
import sharp from "sharp";

const root = path.join(path.dirname(new URL(import.meta.url).pathname), "..");
const dir = path.join(root, "public", "icons");

const outputs: { from: string; to: string; size: number }[] = [
  { from: "sward.svg", to: "icon-192.png", size: 192 },
  { from: "sward.svg", to: "icon-512.png", size: 512 },
  { from: "sward-maskable.svg", to: "icon-maskable-512.png", size: 512 },
  // iOS rounds the corners itself and shows no transparency: the full square.
  // (app/apple-icon.png: Next links it as the apple-touch-icon of every page.)
  { from: "sward-maskable.svg", to: "../../app/apple-icon.png", size: 180 },
];

for (const { from, to, size } of outputs) {
  await sharp(path.join(dir, from), { density: (72 * size) / 32 })
    .resize(size, size)
    .png({ compressionLevel: 9 })
    .toFile(path.join(dir, to));
  console.log(`${path.relative(root, path.join(dir, to))} (${size}×${size})`);
}
