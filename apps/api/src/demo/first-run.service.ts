import { Injectable, Logger, type OnApplicationBootstrap } from '@nestjs/common';
import { WEB_PATHS } from '@rotaplex/contracts';
import { chmodSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { OneTimeTokensService } from '../users/credentials/one-time-tokens.service';
import { PasswordService } from '../users/credentials/password.service';
import { AppConfig } from '../config/app-config';
import { MailService } from '../mail/mail.service';
import { invitationMail } from '../mail/templates';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { UnitEntity } from '../units/unit.entity';
import { UserEntity } from '../users/user.entity';
import { DEMO_ORGANISATION, DEMO_PASSWORD, DEMO_UNITS, DEMO_USERS } from './demo-data';
import { seedDemoDemand } from './demo-demand';
import { seedDemoPlanning } from './demo-planning';

/**
 * On the first start (no organisation yet): with SEED_DEMO, the invented demo organisation and its
 * people; otherwise an empty organisation (ORGANISATION_NAME) and, with ADMIN_EMAIL, an invitation
 * for the first admin (the link is also written to DATA_DIR/first-admin-invitation.txt, mode 0600,
 * never to the log).
 */
/** File in DATA_DIR that holds the first admin's invitation link. */
export const FIRST_ADMIN_LINK_FILE = 'first-admin-invitation.txt';

@Injectable()
export class FirstRunService implements OnApplicationBootstrap {
  private readonly logger = new Logger(FirstRunService.name);

  constructor(
    private readonly config: AppConfig,
    private readonly dataSource: DataSource,
    private readonly passwords: PasswordService,
    private readonly oneTimeTokens: OneTimeTokensService,
    private readonly mail: MailService,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    if ((await this.dataSource.getRepository(OrganisationEntity).count()) > 0) return;
    if (this.config.seedDemo) await this.seedDemo();
    else await this.createEmptyOrganisation();
  }

  /** Seeds the demo; one argon2 hash shared by every demo user keeps it fast. */
  async seedDemo(): Promise<void> {
    const hash = await this.passwords.hash(DEMO_PASSWORD);
    await this.dataSource.transaction(async (em) => {
      const org = await em.save(em.create(OrganisationEntity, { name: DEMO_ORGANISATION }));
      const units = {
        ward: await em.save(em.create(UnitEntity, { organisationId: org.id, ...DEMO_UNITS.ward })),
        contact: await em.save(em.create(UnitEntity, { organisationId: org.id, ...DEMO_UNITS.contact })),
      };
      const usersByEmail = new Map<string, UserEntity>();
      for (const u of DEMO_USERS) {
        const saved = await em.save(
          em.create(UserEntity, {
            organisationId: org.id,
            email: u.email,
            displayName: u.displayName,
            role: u.role,
            passwordHash: hash,
            active: true,
            units: u.unit ? [units[u.unit]] : [],
          }),
        );
        usersByEmail.set(u.email, saved);
      }
      await seedDemoPlanning(em, org.id, units, usersByEmail, new Date());
      await seedDemoDemand(em, units);
    });
    this.logger.log(
      `Demo data seeded: ${DEMO_USERS.length} people. Sign in as admin@example.com, manager@example.com or staff@example.com with the password "${DEMO_PASSWORD}".`,
    );
  }

  private async createEmptyOrganisation(): Promise<void> {
    const adminEmail = this.config.initialAdminEmail;
    const created = await this.dataSource.transaction(async (em) => {
      const org = await em.save(em.create(OrganisationEntity, { name: this.config.organisationName }));
      if (!adminEmail) return null;
      const admin = await em.save(
        em.create(UserEntity, {
          organisationId: org.id,
          email: adminEmail,
          displayName: 'Administrator',
          role: 'admin',
          passwordHash: null,
          active: true,
          units: [],
        }),
      );
      return { org, admin, token: await this.oneTimeTokens.create(em, admin.id, 'invitation') };
    });
    if (!created) {
      this.logger.warn(
        'Created an empty organisation without users: set ADMIN_EMAIL on an empty database to invite the first admin.',
      );
      return;
    }
    const link = `${this.config.publicUrl}${WEB_PATHS.acceptInvitation}?token=${encodeURIComponent(created.token)}`;
    // The link is a working secret: never in the log. Besides the e-mail, it goes to a file in the
    // data directory that only this account can read (beside the JWT secret), for a server whose
    // mail does not arrive yet.
    const file = join(this.config.dataDir, FIRST_ADMIN_LINK_FILE);
    writeFileSync(file, `${link}\n`, { mode: 0o600 });
    chmodSync(file, 0o600);
    this.logger.log(
      `First admin ${created.admin.email} invited: the invitation link was e-mailed` +
        `${this.config.smtp ? '' : ' (no SMTP_HOST: to the local mail catcher)'} and written to ${file} ` +
        '(readable only by this account; single use, delete the file once used)',
    );
    try {
      await this.mail.send({
        to: created.admin.email,
        ...invitationMail({
          displayName: created.admin.displayName,
          organisationName: created.org.name,
          invitedBy: 'Rotaplex',
          link,
          validDays: Math.round(this.oneTimeTokens.ttlSeconds('invitation') / 86400),
        }),
      });
    } catch (err) {
      this.logger.error(
        `The first admin's invitation could not be e-mailed (${(err as Error).message}); the link is in ${file}.`,
      );
    }
  }
}
