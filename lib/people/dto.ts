// A person of the company, as staff screens show them.
import type { Role } from "@/db/schema";

export interface PersonDto {
  id: string;
  name: string;
  email: string;
  role: Role;
  isDisabled: boolean;
}
