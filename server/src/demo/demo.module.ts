import { Module } from '@nestjs/common';
import { RegionsModule } from '../regions/regions.module.js';
import { UsersModule } from '../users/users.module.js';
import { DemoSeeder } from './demo.seeder.js';

@Module({ imports: [UsersModule, RegionsModule], providers: [DemoSeeder] })
export class DemoModule {}
