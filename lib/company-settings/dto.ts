export interface CompanySettingsDto {
  companyName: string;
  locale: string;
  timeZone: string;
}
