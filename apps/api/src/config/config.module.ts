import { type DynamicModule, Global, Module } from '@nestjs/common';
import { AppConfig } from './app-config';

/** Makes the validated {@link AppConfig} injectable everywhere by its class. */
@Global()
@Module({})
export class ConfigModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: ConfigModule,
      providers: [{ provide: AppConfig, useValue: config }],
      exports: [AppConfig],
    };
  }
}
