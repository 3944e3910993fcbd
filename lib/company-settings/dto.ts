export interface CompanySettingsDto {
  companyName: string;
  locale: string;
  timeZone: string;
  /** Where each day's route starts and ends; null location: not set. */
  yard: { address: string; latitude: number | null; longitude: number | null };
}
