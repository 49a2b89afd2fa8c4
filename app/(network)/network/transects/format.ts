/** Metres as people read a walk's length: "850 m", "2.4 km". */
export const distance = (metres: number) => (metres < 1000 ? `${metres.toLocaleString("en-GB")} m` : `${(metres / 1000).toLocaleString("en-GB", { maximumFractionDigits: 1 })} km`);

export const plural = (n: number, one: string, many = `${one}s`) => `${n.toLocaleString("en-GB")} ${n === 1 ? one : many}`;

export const dayOf = (iso: string | null) => (iso ? new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" }) : "—");
