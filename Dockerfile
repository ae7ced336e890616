# The app image for docker-compose: a production build served by `next start`.
FROM node:20-bookworm-slim
WORKDIR /app
ENV NEXT_TELEMETRY_DISABLED=1
COPY package.json package-lock.json ./
RUN npm ci --no-audit --no-fund
COPY . .
RUN cp -n .env.example .env && npx next build
EXPOSE 3000
CMD ["npx", "tsx", "scripts/container-start.ts"]
