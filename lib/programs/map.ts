// Program rows ↔ DTOs: a round's columns from its input, a round row as the DTO.
import type { Insertable, Selectable } from "kysely";

import type { Database } from "@/db/schema";

import type { ProgramMethodDto, ProgramRoundDto, ProgramWindowDto } from "./dto";
import type { ProgramRoundInput } from "./schemas";

type RoundRow = Selectable<Database["program_rounds"]>;

export function roundColumns(
  companyId: string,
  programId: string,
  id: string,
  position: number,
  r: ProgramRoundInput,
): Insertable<Database["program_rounds"]> {
  const dates = r.windowKind === "dates";
  // Only what the target uses is kept: a product with "no nitrogen" stays (weed control), its N does not.
  const method = (m: ProgramRoundInput["granular"]) => ({
    product: m.productId,
    target: m.target,
    nLb: m.target === "lb" ? Math.round((m.nLb ?? 0) * 100) / 100 : null,
  });
  const g = method(r.granular);
  const l = method(r.liquid);
  return {
    id,
    company_id: companyId,
    program_id: programId,
    position,
    kind: r.kind,
    window_kind: r.windowKind,
    start_md: dates ? r.startMd : null,
    end_md: dates ? r.endMd : null,
    trigger_base_f: r.windowKind === "gdd" ? r.triggerBaseF : null,
    trigger_value: dates ? null : r.triggerValue,
    window_days: dates ? null : r.windowDays,
    granular_product_id: g.product,
    granular_target: g.target,
    granular_n_lb: g.nLb,
    liquid_product_id: l.product,
    liquid_target: l.target,
    liquid_n_lb: l.nLb,
  };
}

export function toRoundDto(r: RoundRow): ProgramRoundDto {
  const num = (v: number | null) => (v === null ? null : Number(v));
  let window: ProgramWindowDto;
  if (r.window_kind === "dates") window = { kind: "dates", startMd: r.start_md!, endMd: r.end_md! };
  else if (r.window_kind === "gdd")
    window = {
      kind: "gdd",
      baseF: Number(r.trigger_base_f),
      value: Number(r.trigger_value),
      days: r.window_days!,
    };
  else window = { kind: r.window_kind, value: Number(r.trigger_value), days: r.window_days! };
  const method = (
    productId: string | null,
    target: ProgramMethodDto["target"],
    nLb: number | null,
  ): ProgramMethodDto => ({ productId, target, nLb: num(nLb) });
  return {
    position: r.position,
    kind: r.kind,
    window,
    granular: method(r.granular_product_id, r.granular_target, r.granular_n_lb),
    liquid: method(r.liquid_product_id, r.liquid_target, r.liquid_n_lb),
  };
}
