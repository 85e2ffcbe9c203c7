#!/usr/bin/env Rscript
# Reference values for randomInterceptModel and likelihoodRatioTest (run: npm run fixtures:lme4).
#
# Writes tests/fixtures/lme4/*.json. Each file records the R, lme4, Matrix and jsonlite versions and
# this script's path. The data are drawn here from R's default generator (Mersenne-Twister,
# Inversion) with fixed seeds and rounded to 1e-6, and are written into the JSON, so the TypeScript
# tests never reproduce the generator. Nothing is hand-typed: every expected value is the output of
# the lme4 call named in the "source" fields.
#
# lme4 is fitted with tight optimizer tolerances (BOBYQA through nloptwrap, xtol/ftol 1e-14 instead of
# the defaults ~1e-8), so that its variance estimates carry more digits than the 1e-6 relative test
# tolerance. Needs Debian's r-cran-lme4 and r-cran-jsonlite.
suppressPackageStartupMessages({
  library(lme4)
  library(jsonlite)
})

root <- normalizePath(file.path(dirname(sub("^--file=", "", grep("^--file=", commandArgs(FALSE), value = TRUE))), ".."))
out_dir <- file.path(root, "tests", "fixtures", "lme4")
dir.create(out_dir, recursive = TRUE, showWarnings = FALSE)

tight <- lmerControl(
  optimizer = "nloptwrap",
  optCtrl = list(xtol_abs = 1e-14, ftol_abs = 1e-14, xtol_rel = 1e-14, ftol_rel = 1e-15, maxeval = 100000),
  check.conv.singular = "ignore"
)

meta <- function(description) {
  list(
    generator = "scripts/generate-mixed-model-fixtures.R",
    R = R.version.string,
    lme4 = as.character(packageVersion("lme4")),
    Matrix = as.character(packageVersion("Matrix")),
    jsonlite = as.character(packageVersion("jsonlite")),
    description = description
  )
}

fit_summary <- function(fit) {
  vc <- as.data.frame(VarCorr(fit))
  list(
    coefficients = I(unname(fixef(fit))),
    standardErrors = I(unname(sqrt(diag(as.matrix(vcov(fit)))))),
    clusterVariance = vc$vcov[vc$grp == "cluster"],
    residualVariance = vc$vcov[vc$grp == "Residual"],
    logLikelihood = as.numeric(logLik(fit)),
    theta = unname(getME(fit, "theta")),
    source = sprintf(
      "lme4::lmer(y ~ ... + (1 | cluster), REML = %s): fixef, sqrt(diag(vcov)), VarCorr, logLik",
      if (isREML(fit)) "TRUE" else "FALSE"
    )
  )
}

# The columns of the fixed-effects design without the intercept, as the TypeScript function takes them.
predictor_columns <- function(fit) {
  x <- getME(fit, "X")
  if (ncol(x) == 1) return(list())
  lapply(seq(2, ncol(x)), function(j) unname(x[, j]))
}

case <- function(name, description, formula, data) {
  reml <- lmer(formula, data = data, REML = TRUE, control = tight)
  ml <- lmer(formula, data = data, REML = FALSE, control = tight)
  list(
    name = name,
    description = description,
    formula = paste(deparse(formula), collapse = " "),
    predictorNames = I(colnames(getME(reml, "X"))[-1]),
    predictors = predictor_columns(reml),
    y = data$y,
    clusters = as.character(data$cluster),
    REML = fit_summary(reml),
    ML = fit_summary(ml)
  )
}

write_fixture <- function(file, payload) {
  path <- file.path(out_dir, file)
  writeLines(toJSON(payload, auto_unbox = TRUE, digits = NA, pretty = TRUE), path)
  cat("wrote", file.path("tests", "fixtures", "lme4", file), "\n")
}

r6 <- function(x) round(x, 6)

cases <- list()

# 1. Balanced: 6 clusters x 5 observations, intercept only.
set.seed(20261203)
d <- data.frame(cluster = factor(rep(sprintf("t%02d", 1:6), each = 5)))
b <- rnorm(6, 0, 0.3)
d$y <- r6(-3 + b[as.integer(d$cluster)] + rnorm(30, 0, 0.25))
cases[[length(cases) + 1]] <- case("balanced", "6 clusters x 5, intercept only", y ~ 1 + (1 | cluster), d)

# 2. Unbalanced: 9 clusters of 2..10 observations, one continuous predictor.
set.seed(20261204)
sizes <- c(2, 7, 3, 10, 4, 6, 5, 9, 8)
d <- data.frame(cluster = factor(rep(sprintf("t%02d", seq_along(sizes)), times = sizes)))
d$x <- r6(runif(nrow(d), 0, 10))
b <- rnorm(length(sizes), 0, 0.5)
d$y <- r6(1.5 + 0.2 * d$x + b[as.integer(d$cluster)] + rnorm(nrow(d), 0, 0.4))
cases[[length(cases) + 1]] <- case("unbalanced", "9 clusters of 2..10, one continuous predictor", y ~ x + (1 | cluster), d)

# 3. Cluster variance estimated as 0 under both REML and ML: no cluster effect in the data; the
#    first seed from 20261205 upward whose REML and ML fits both land on the boundary.
seed <- 20261205
repeat {
  set.seed(seed)
  sizes <- c(4, 6, 5, 7, 3, 6, 5)
  d <- data.frame(cluster = factor(rep(sprintf("t%02d", seq_along(sizes)), times = sizes)))
  d$x <- r6(runif(nrow(d), -1, 1))
  d$y <- r6(0.7 - 0.3 * d$x + rnorm(nrow(d), 0, 0.2))
  z <- case("zeroClusterVariance", sprintf("no cluster effect (seed %d), both fits singular", seed), y ~ x + (1 | cluster), d)
  if (z$REML$theta == 0 && z$ML$theta == 0) break
  seed <- seed + 1
}
cases[[length(cases) + 1]] <- z

# 4. Log run CV ~ group (3 methods) + attempt number, trainee as cluster; trainees try several methods.
set.seed(20261206)
trainees <- sprintf("tr%02d", 1:12)
rows <- do.call(rbind, lapply(seq_along(trainees), function(i) {
  n <- 3 + (i %% 5)
  data.frame(cluster = trainees[i], method = sample(c("A", "B", "C"), n, replace = TRUE), attempt = seq_len(n))
}))
rows$cluster <- factor(rows$cluster)
rows$method <- factor(rows$method, levels = c("A", "B", "C"))
skill <- rnorm(length(trainees), 0, 0.15)
effect <- c(A = 0, B = -0.25, C = 0.1)
rows$y <- r6(log(0.05) + effect[as.character(rows$method)] - 0.03 * rows$attempt +
               skill[as.integer(rows$cluster)] + rnorm(nrow(rows), 0, 0.2))
d4 <- rows
cases[[length(cases) + 1]] <- case("groupAndAttempt", "log run CV ~ method (A, B, C) + attempt, trainee as cluster",
                                   y ~ method + attempt + (1 | cluster), d4)

# Likelihood-ratio test of the method effect from ML fits (anova refits with ML; we fit ML directly).
full <- lmer(y ~ method + attempt + (1 | cluster), data = d4, REML = FALSE, control = tight)
reduced <- lmer(y ~ attempt + (1 | cluster), data = d4, REML = FALSE, control = tight)
a <- anova(reduced, full)
lrt <- list(
  fullLogLik = as.numeric(logLik(full)),
  reducedLogLik = as.numeric(logLik(reduced)),
  reducedPredictors = predictor_columns(reduced),
  statistic = a$Chisq[2],
  df = a$Df[2],
  pValue = a[["Pr(>Chisq)"]][2],
  source = "anova(lmer(y ~ attempt + (1|cluster), REML=FALSE), lmer(y ~ method + attempt + (1|cluster), REML=FALSE)): Chisq, Df, Pr(>Chisq)"
)

write_fixture("random-intercept.json", list(meta = meta("Random-intercept linear mixed models fitted by lme4 (REML and ML)"),
                                            cases = cases, likelihoodRatio = lrt))
