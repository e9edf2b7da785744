import type { RouteSpec } from '../http/route-spec';
import { createRouteSpecs } from './create-route-specs';
import { createServices, type ServiceDependencies, type Services } from './create-services';

export interface ComposedApi {
  services: Services;
  routeSpecs: RouteSpec[];
  /** Stops background work (replay workers); the caller stops the mail queue and closes the database. */
  shutdown: () => Promise<void>;
}

/** The composition root: services, then the routes that call them. `createApp` serves the result. */
export function composeApi(dependencies: ServiceDependencies): ComposedApi {
  const services = createServices(dependencies);
  return {
    services,
    routeSpecs: createRouteSpecs(services, dependencies.config),
    shutdown: () => services.replayWorkers.close(),
  };
}
