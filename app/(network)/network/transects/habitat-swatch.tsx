import { colourHex } from "@/lib/geo/palette";

/** A habitat group's colour beside its name (the name carries the meaning, not the colour). */
export function HabitatSwatch({ colour, name }: { colour: string; name: string }) {
  return (
    <span className="inline-flex items-center gap-2">
      <span aria-hidden="true" className="inline-block h-3 w-6 rounded-sm" style={{ background: colourHex(colour) }} />
      {name}
    </span>
  );
}
