# The production image: build once, run the Nitro server as an unprivileged user; configuration comes
# from the environment (see the README's table). Node 22 is an LTS line that runs this project's pins.
FROM node:22.12.0-bookworm-slim AS build
WORKDIR /app
COPY package.json package-lock.json ./
RUN npm ci
COPY . .
RUN npx nuxt build

FROM node:22.12.0-bookworm-slim
WORKDIR /app
ENV NODE_ENV=production PORT=3000 HOST=0.0.0.0
# The image's own `node` user; the SQLite file (when DATABASE_URL is a file) lives in a folder it owns.
RUN mkdir -p /app/.data && chown node:node /app/.data
COPY --from=build --chown=node:node /app/.output ./.output
USER node
EXPOSE 3000
VOLUME ["/app/.data"]
# No curl in the slim image: Node's own fetch asks the health route, which also touches the database.
HEALTHCHECK --interval=30s --timeout=5s --start-period=20s --retries=3 \
  CMD ["node", "-e", "fetch('http://127.0.0.1:'+(process.env.PORT||3000)+'/api/health').then(r=>process.exit(r.ok?0:1)).catch(()=>process.exit(1))"]
CMD ["node", ".output/server/index.mjs"]
