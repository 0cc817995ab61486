import type { DataSource } from 'typeorm';
import type { ComplianceNoticeDto } from '@shared/reports/compliance-report-dto';
import { percentOfBudget } from '@shared/reports/budget-compliance';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { BudgetsService } from '../../budgets/domain/budgets-service';
import { lastDayOf } from '../../budgets/domain/budgets-service';
import type { MailQueue } from '../../mail/domain/mail-queue';
import type { DailyUseRepository } from '../../readings/data/daily-use-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { ComplianceNoticesRepository } from '../data/compliance-notices-repository';
import { localDate, type ComplianceService } from './compliance-service';
import { noticeMail } from './notice-mail';

/**
 * Budget notices to a site's managers. Auditors are read-only on site data, but contacting sites over budget is
 * their job, so they may send notices on any site shared with their utility (as may the owner's managers and
 * admins). One notice per site and month: a second request is a 409, and the mail queue dedupes as well.
 */
export class ComplianceNoticeService {
  constructor(
    private readonly db: DataSource,
    private readonly sites: SitesService,
    private readonly compliance: ComplianceService,
    private readonly budgets: BudgetsService,
    private readonly dailyUse: DailyUseRepository,
    private readonly notices: ComplianceNoticesRepository,
    private readonly audit: AuditRepository,
    private readonly mailQueue: MailQueue,
    private readonly publicUrl: string,
  ) {}

  async send(
    principal: Principal,
    siteId: number,
    input: { month?: string; message?: string },
  ): Promise<ComplianceNoticeDto> {
    this.compliance.requireReportRole(principal);
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    const month = input.month ?? previousMonth(localDate(site.timeZone));
    const existing = await this.notices.find(siteId, month);
    if (existing)
      throw new AppError(
        'conflict',
        `A notice for ${site.name} and ${month} was already sent on ${existing.sentAt.toISOString().slice(0, 10)}.`,
        [{ field: 'month', message: 'a notice was already sent for this month' }],
      );
    const recipients = await this.notices.recipients(site.organisationId);
    if (!recipients.length)
      throw AppError.invalid('siteId', 'the organisation that owns this site has no active manager to notify');
    const useGal = (await this.dailyUse.monthly([siteId], `${month}-01`, lastDayOf(month)))[0]?.gallons ?? 0;
    let budgetGal: number | null = null;
    try {
      budgetGal = (await this.budgets.budget(principal, siteId, month, month, 'none')).months[0]!.gallons;
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
    }
    const percent = percentOfBudget(useGal, budgetGal);
    const message = (input.message ?? '').trim();
    const inserted = await this.db.transaction(async (em) => {
      const fresh = await this.notices.insert(em, {
        siteId,
        month,
        sentBy: principal.userId,
        senderOrganisationId: principal.organisationId,
        recipients: recipients.length,
        percentOfBudget: percent,
        message,
      });
      if (!fresh) return false;
      for (const r of recipients) {
        const mail = noticeMail({
          to: r,
          siteName: site.name,
          siteId,
          month,
          useGal,
          budgetGal,
          percent,
          message,
          sender: principal,
          publicUrl: this.publicUrl,
        });
        // Sent by the auditor's organisation to the owning organisation's people: both see it in their outbox.
        await this.mailQueue.enqueue(
          em,
          { ...mail, organisationIds: [principal.organisationId, site.organisationId] },
          `compliance-notice:${siteId}:${month}:${r.userId}`,
        );
      }
      // Logged under the owning organisation, so it shows in the site's own history.
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'compliance-notice',
        changes: {
          month,
          recipients: recipients.map((r) => r.email),
          percentOfBudget: percent,
          message,
          senderOrganisationId: principal.organisationId,
        },
      });
      return true;
    });
    if (!inserted)
      throw new AppError('conflict', `A notice for ${site.name} and ${month} was already sent.`, [
        { field: 'month', message: 'a notice was already sent for this month' },
      ]);
    this.mailQueue.kick();
    return { siteId, month, recipients: recipients.length, sentAt: new Date().toISOString() };
  }
}

function previousMonth(date: string): string {
  const [y, m] = date.split('-').map(Number) as [number, number];
  return new Date(Date.UTC(y, m - 2, 1)).toISOString().slice(0, 7);
}
