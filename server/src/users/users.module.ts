import { Module } from '@nestjs/common';
import { UsersController } from './users.controller';
import { UsersRepository } from './users.repository';
import { UsersService } from './users.service';

@Module({ controllers: [UsersController], providers: [UsersRepository, UsersService], exports: [UsersService] })
export class UsersModule {}
