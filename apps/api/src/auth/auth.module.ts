import { ThrottlerStorageRedisService } from '@nest-lab/throttler-storage-redis';
import { Module } from '@nestjs/common';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { ThrottlerModule } from '@nestjs/throttler';
import { AppConfig } from '../config/app-config';
import { MailModule } from '../mail/mail.module';
import { OrganisationModule } from '../organisation/organisation.module';
import { UsersModule } from '../users/users.module';
import { authThrottlers, AuthThrottlerGuard } from './auth-throttler.guard';
import { ClusterSignInAddressLimiter } from './cluster-sign-in-address-limiter';
import { RedisConnections } from '../redis/redis-connections';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { JWT_AUDIENCE, JWT_ISSUER, JwtStrategy } from './jwt.strategy';
import { MeController } from './me.controller';
import { SignInAddressLimiter } from './sign-in-address-limiter';
import { TokensModule } from '../users/credentials/tokens.module';

@Module({
  imports: [
    PassportModule,
    JwtModule.registerAsync({
      inject: [AppConfig],
      useFactory: (config: AppConfig) => ({
        secret: config.jwtSecret!,
        signOptions: {
          algorithm: 'HS256',
          expiresIn: config.jwtAccessTtl,
          issuer: JWT_ISSUER,
          audience: JWT_AUDIENCE,
        },
      }),
    }),
    ThrottlerModule.forRootAsync({
      inject: [AppConfig, RedisConnections],
      useFactory: (config: AppConfig, redis: RedisConnections | null) => ({
        throttlers: authThrottlers(config.loginRateLimit),
        // Several API instances count sign-in attempts together in Redis (REDIS_URL); one process in memory.
        ...(redis ? { storage: new ThrottlerStorageRedisService(redis.throttle) } : {}),
        errorMessage: 'Too many attempts: wait a minute and try again',
      }),
    }),
    TokensModule,
    UsersModule,
    OrganisationModule,
    MailModule,
  ],
  controllers: [AuthController, MeController],
  providers: [
    AuthService,
    JwtStrategy,
    AuthThrottlerGuard,
    {
      // With REDIS_URL, failed sign-ins per address are counted across the API instances.
      provide: SignInAddressLimiter,
      inject: [AppConfig, RedisConnections],
      useFactory: async (config: AppConfig, redis: RedisConnections | null) => {
        if (!redis) return new SignInAddressLimiter(config);
        const limiter = new ClusterSignInAddressLimiter(config, redis);
        await limiter.listen();
        return limiter;
      },
    },
  ],
})
export class AuthModule {}
