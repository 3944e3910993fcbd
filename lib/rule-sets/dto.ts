// A fertiliser rule set as screens show it.
export interface RuleSetDto {
  id: string;
  name: string;
  citation: string;
}
