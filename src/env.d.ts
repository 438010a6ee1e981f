/// <reference path="../.astro/types.d.ts" />

declare namespace App {
  interface Locals {
    /** The request's own EntityManager (a fork, see middleware). */
    em: import('@mikro-orm/postgresql').EntityManager;
  }
}
