// What the watering log reads return.
export interface WateringDto {
  id: string;
  zoneId: string | null;
  zoneName: string | null;
  wateredOn: string;
  depthIn: number;
  runMinutes: number | null;
  precipitationRateInPerHour: number | null;
  enteredBy: string | null;
  enteredByRole: "manager" | "technician" | "homeowner";
  /** Who entered it (their own entries can be corrected and deleted). */
  enteredById: string | null;
  /** The visit it was recorded on, if any. */
  visitId: string | null;
  notes: string;
}
