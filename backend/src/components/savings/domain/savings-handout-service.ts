import type { Principal } from '../../../platform/auth/principal';
import { reportFormat } from '../../../platform/report-format';
import type { OrganisationSettingsService } from '../../organisations/domain/organisation-settings-service';
import { savingsHandoutPdf } from './savings-handout';
import type { SavingsReportService } from './savings-report-service';

/** The client handout of a project, in the units of the organisation that prints it. */
export class SavingsHandoutService {
  constructor(
    private readonly reports: SavingsReportService,
    private readonly settings: OrganisationSettingsService,
  ) {}

  async handout(principal: Principal, id: number): Promise<{ pdf: Buffer; fileName: string }> {
    const report = await this.reports.report(principal, id);
    const { unitSystem } = await this.settings.get(principal);
    const pdf = await savingsHandoutPdf(report, reportFormat(unitSystem), new Date().toISOString());
    const safe = report.project.title.replace(/[^A-Za-z0-9-]+/g, '-').replace(/^-|-$/g, '') || 'savings';
    return { pdf, fileName: `${safe.slice(0, 60)}-handout.pdf` };
  }
}
