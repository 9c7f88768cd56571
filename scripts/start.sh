#!/usr/bin/env bash
# The start command. The API, the apps, maildev and the Stripe stand-in are not
# built yet (the platform issue); until they are, say so and stop.
echo "Benchwright's product stack (API, client portal, shop app, maildev, Stripe stand-in) is not built yet."
echo "What exists is the engine in packages/pricing; run 'bash scripts/test.sh' to test it."
exit 1
