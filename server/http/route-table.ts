import { Router, type RequestHandler } from 'express';

// A thin wrapper over an Express router that records every route it mounts, so
// the permission test can check that each route of the app is in its table.

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
export interface RouteEntry {
  method: Method;
  path: string;
}

export class RouteTable {
  readonly router = Router();
  readonly entries: RouteEntry[] = [];

  private add(method: Method, path: string, handlers: RequestHandler[]): void {
    this.entries.push({ method, path });
    this.router[method](path, ...handlers);
  }

  get = (path: string, ...h: RequestHandler[]) => this.add('get', path, h);
  post = (path: string, ...h: RequestHandler[]) => this.add('post', path, h);
  put = (path: string, ...h: RequestHandler[]) => this.add('put', path, h);
  patch = (path: string, ...h: RequestHandler[]) => this.add('patch', path, h);
  delete = (path: string, ...h: RequestHandler[]) => this.add('delete', path, h);
}
