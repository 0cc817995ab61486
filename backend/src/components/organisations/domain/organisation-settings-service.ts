import type { DataSource } from 'typeorm';
import { capabilities } from '@shared/auth/roles';
import type { OrganisationSettingsDto, UnitSystem } from '@shared/budgets/budget-dto';
import type { DateOrder } from '@shared/ingest/date-order';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { OrganisationsRepository } from '../data/organisations-repository';

/** Settings of the organisation the user acts for; everyone reads them, administrators change them. */
export class OrganisationSettingsService {
  constructor(
    private readonly db: DataSource,
    private readonly organisations: OrganisationsRepository,
    private readonly audit: AuditRepository,
  ) {}

  async get(principal: Principal): Promise<OrganisationSettingsDto> {
    const settings = await this.organisations.settings(principal.organisationId);
    if (!settings) throw AppError.notFound('Organisation');
    return settings;
  }

  /** For uploads: the organisation's usual day/month order (null when it has none). */
  async usualDateOrder(organisationId: number): Promise<DateOrder | null> {
    return (await this.organisations.settings(organisationId))?.dateOrder ?? null;
  }

  async update(
    principal: Principal,
    patch: { unitSystem?: UnitSystem; dateOrder?: DateOrder | null },
  ): Promise<OrganisationSettingsDto> {
    if (!capabilities(principal.role).manageSettings)
      throw AppError.forbidden('Only administrators can change organisation settings.');
    const before = await this.get(principal);
    if (patch.dateOrder !== undefined && patch.dateOrder !== before.dateOrder) {
      await this.db.transaction(async (em) => {
        await this.organisations.setDateOrder(em, principal.organisationId, patch.dateOrder!);
        await this.audit.record(em, {
          userId: principal.userId,
          organisationId: principal.organisationId,
          entity: 'organisation',
          entityId: principal.organisationId,
          action: 'settings',
          changes: { dateOrder: [before.dateOrder, patch.dateOrder] },
        });
      });
    }
    if (patch.unitSystem && patch.unitSystem !== before.unitSystem) {
      await this.db.transaction(async (em) => {
        await this.organisations.setUnitSystem(em, principal.organisationId, patch.unitSystem!);
        await this.audit.record(em, {
          userId: principal.userId,
          organisationId: principal.organisationId,
          entity: 'organisation',
          entityId: principal.organisationId,
          action: 'settings',
          changes: { unitSystem: [before.unitSystem, patch.unitSystem] },
        });
      });
    }
    return this.get(principal);
  }
}
