import express, { type ErrorRequestHandler, type RequestHandler } from 'express';
import request from 'supertest';
import { inSequence } from '../../server/http/in-sequence';

/** An app whose one API layer is `steps` in sequence, answering with the steps that ran, or with the error's text. */
function appOf(...steps: RequestHandler[]) {
  const app = express();
  app.use('/api', (req, _res, next) => {
    req.ran = [];
    next();
  });
  app.use('/api', inSequence(...steps));
  app.get('/api/thing', (req, res) => res.json({ ran: req.ran, url: req.url, baseUrl: req.baseUrl }));
  const onError: ErrorRequestHandler = (err: Error, req, res, _next) => {
    res.status(500).json({ ran: req.ran, error: err.message });
  };
  app.use(onError);
  return app;
}

const step =
  (name: string): RequestHandler =>
  (req, _res, next) => {
    req.ran.push(name);
    next();
  };

declare module 'express-serve-static-core' {
  interface Request {
    ran: string[];
  }
}

describe('middleware run in sequence as one layer', () => {
  it('when every step calls next, then they run in order and the route sees the address unchanged', async () => {
    const later: RequestHandler = (req, _res, next) => {
      setImmediate(() => {
        req.ran.push('later');
        next();
      });
    };

    const res = await request(appOf(step('a'), later, step('b'))).get('/api/thing?x=1');

    expect(res.body).toEqual({ ran: ['a', 'later', 'b'], url: '/api/thing?x=1', baseUrl: '' });
  });

  it('when a step passes an error to next, then the steps after it do not run and the error handler answers', async () => {
    const failing: RequestHandler = (req, _res, next) => {
      req.ran.push('failing');
      next(new Error('passed on'));
    };

    const res = await request(appOf(step('a'), failing, step('b'))).get('/api/thing');

    expect(res.status).toBe(500);
    expect(res.body).toEqual({ ran: ['a', 'failing'], error: 'passed on' });
  });

  it('when a step throws, then the steps after it do not run and the error handler answers', async () => {
    const throwing: RequestHandler = () => {
      throw new Error('thrown');
    };

    const res = await request(appOf(step('a'), throwing, step('b'))).get('/api/thing');

    expect(res.body).toEqual({ ran: ['a'], error: 'thrown' });
  });

  it('when an async step rejects, then the error handler answers, as Express 5 does for a route', async () => {
    const rejecting: RequestHandler = async (req) => {
      req.ran.push('rejecting');
      await Promise.resolve();
      throw new Error('rejected');
    };

    const res = await request(appOf(rejecting, step('b'))).get('/api/thing');

    expect(res.body).toEqual({ ran: ['rejecting'], error: 'rejected' });
  });

  it('when a step answers without calling next, then nothing after it runs', async () => {
    const answering: RequestHandler = (req, res) => {
      res.status(204).end();
    };

    const res = await request(appOf(answering, step('b'))).get('/api/thing');

    expect(res.status).toBe(204);
  });
});
