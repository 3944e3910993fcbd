// Input schemas for property endpoints.
import { z } from "zod";

export const propertyIdParams = z.object({ propertyId: z.uuid() });
