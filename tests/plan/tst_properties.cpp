// SPDX-License-Identifier: MIT
// Property run over 10,000 random briefs with fixed seeds (20 batches): 1–200 rooms,
// random facade wishes, door/wall and must/should mixes, some non-planar
// (extra random adjacencies), some disconnected, some with targets far over
// the footprint or rooms wider than it, some with random sketches. For each:
// buildPlan returns, never an internal error; every variant passes
// checkVariant (tiling of the footprint, every kept adjacency a shared wall,
// doors at least doorWidth) and checkRegularEdgeLabeling; a brief without a
// plan says why. Planning options are light (one corner assignment, one
// labeling, one sizing) because the property is robustness, not plan
// quality; the count can be raised with ABUT_PROPERTY_BRIEFS.
#include "brief/footprint_check.h"
#include "label/regular_edge_labeling.h"
#include "plan/plan_builder.h"
#include "plan/unmet.h"

#include "../support/random_briefs.h"

#include <QtTest>

#include <chrono>

using namespace abut;

namespace {

struct Mix {
    int nonPlanar = 0, disconnected = 0, overFootprint = 0, tooWide = 0, sketched = 0;
};

Brief propertyBrief(std::mt19937& rng, Mix& mix) {
    std::uniform_real_distribution<double> coin(0.0, 1.0);
    testing::RandomBriefOptions o;
    // Mostly small and middling briefs, a tail up to 200 rooms.
    const double u = coin(rng);
    o.rooms = 1 + static_cast<int>(u * u * 199.0);
    o.keepEdge = 0.3 + 0.7 * coin(rng); // low keep rates leave groups apart
    o.facadeWish = coin(rng) * 0.6;
    o.shouldShare = coin(rng);
    o.wallShare = coin(rng);
    o.withSketch = coin(rng) < 0.2;
    mix.sketched += o.withSketch;
    Brief b = testing::randomBrief(o, rng);
    const int n = o.rooms;
    if (n >= 5 && coin(rng) < 0.25) {
        // Extra adjacencies between random pairs: usually non-planar.
        const int extra = 1 + static_cast<int>(coin(rng) * n);
        std::uniform_int_distribution<int> pick(0, n - 1);
        for (int k = 0; k < extra; ++k) {
            const int a = pick(rng), c = pick(rng);
            if (a == c) continue;
            bool dup = false;
            for (const Adjacency& adj : b.adjacencies)
                dup |= (adj.a == b.rooms[a].id && adj.b == b.rooms[c].id) ||
                       (adj.b == b.rooms[a].id && adj.a == b.rooms[c].id);
            if (!dup) b.adjacencies.push_back({b.rooms[a].id, b.rooms[c].id});
        }
        ++mix.nonPlanar;
    }
    if (coin(rng) < 0.1 && n >= 4) {
        // Cut every adjacency of a random half of the rooms' ids: separate groups.
        std::erase_if(b.adjacencies, [&](const Adjacency& a) {
            return (std::hash<std::string>{}(a.a) % 2) != (std::hash<std::string>{}(a.b) % 2);
        });
        ++mix.disconnected;
    }
    for (Room& r : b.rooms)
        if (coin(rng) < 0.3) r.minWidth = 1.0 + 2.5 * coin(rng);
    const double total = b.totalTargetArea();
    const double roll = coin(rng);
    if (roll < 0.5) {
        const double w = std::sqrt(total * (1.0 + 0.3 * coin(rng))) * (0.6 + 0.8 * coin(rng));
        b.footprint = Footprint{w, total * (1.05 + 0.3 * coin(rng)) / w};
    } else if (roll < 0.58) {
        const double w = std::sqrt(total) * 0.8;
        b.footprint = Footprint{w, w * 0.5}; // impossible: targets far over the footprint
        ++mix.overFootprint;
    } else if (roll < 0.62 && n > 0) {
        const double w = std::sqrt(total * 1.2);
        b.footprint = Footprint{w, w * 1.2};
        b.rooms[0].minWidth = 3.0 * w; // impossible: wider than the footprint
        ++mix.tooWide;
    }
    if (coin(rng) < 0.1) b.units = "ft";
    return b;
}

} // namespace

class TestProperties : public QObject {
    Q_OBJECT
private slots:
    // Twenty batches of 500 briefs (ABUT_PROPERTY_BATCH), each with its own
    // seed, so that every batch stays well inside Qt Test's per-function
    // time limit.
    void randomBriefsPlanOrExplain_data() {
        QTest::addColumn<unsigned>("seed");
        QTest::addColumn<int>("count");
        const int total = qEnvironmentVariableIsSet("ABUT_PROPERTY_BRIEFS")
                              ? qEnvironmentVariableIntValue("ABUT_PROPERTY_BRIEFS")
                              : 10000;
        const int size = qEnvironmentVariableIsSet("ABUT_PROPERTY_BATCH")
                             ? std::max(1, qEnvironmentVariableIntValue("ABUT_PROPERTY_BATCH"))
                             : 500;
        for (int done = 0, batch = 0; done < total; done += size, ++batch)
            QTest::newRow(qPrintable(QString("batch %1").arg(batch)))
                << unsigned(20261201 + batch) << std::min(size, total - done);
    }
    void randomBriefsPlanOrExplain() {
        QFETCH(unsigned, seed);
        QFETCH(int, count);
        PlanOptions light;
        light.variants = 2;
        light.cornerTrials = 1;
        light.augmentations = 1;
        light.labelingsPerGraph = 2;
        light.sizedCandidates = 1;
        light.improvedCandidates = 0;
        light.searchMoves = 2000; // a short plan search: every variant is still checked
        light.threads = 1;
        light.variantFlips = 0;
        std::mt19937 rng(seed);
        Mix mix;
        int withPlan = 0, withoutPlan = 0, variantsChecked = 0;
        double slowest = 0;
        int slowestRooms = 0;
        const bool trace = qEnvironmentVariableIsSet("ABUT_PROPERTY_TRACE"); // each brief as it starts
        for (int k = 0; k < count; ++k) {
            const Brief b = propertyBrief(rng, mix);
            const auto t0 = std::chrono::steady_clock::now();
            // What must give is worked out for one brief in 50 (it re-sizes the
            // plan a few times): enough to run it on every kind of brief.
            light.relaxations = k % 50 == 0;
            if (trace) qInfo("brief %d: %d rooms", k, int(b.rooms.size()));
            const Plan plan = buildPlan(b, light);
            const double took = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
            if (took > slowest) {
                slowest = took;
                slowestRooms = int(b.rooms.size());
            }
            const QByteArray where = "brief " + QByteArray::number(k) + " (" +
                                     QByteArray::number(int(b.rooms.size())) + " rooms)";
            QVERIFY2(plan.status != PlanStatus::Internal, (where + ": " + plan.summary.c_str()).constData());
            QVERIFY2(!plan.summary.empty(), where.constData());
            if (plan.variants.empty()) {
                ++withoutPlan;
                // No plan is only acceptable for an empty brief, and it says why.
                QVERIFY2(b.rooms.empty(), (where + ": no variant: " + plan.summary.c_str()).constData());
                continue;
            }
            ++withPlan;
            for (const PlanVariant& v : plan.variants) {
                const StageCheck bad = checkVariant(b, plan.footprint, v);
                QVERIFY2(bad.ok, (where + ": " + bad.problem.c_str()).constData());
                const StageCheck labeling = checkRegularEdgeLabeling(v.extended, v.labeling);
                QVERIFY2(labeling.ok, (where + ": labeling: " + labeling.problem.c_str()).constData());
                ++variantsChecked;
            }
            // A brief that cannot fit its footprint is planned (minimums kept,
            // areas relaxed) and says what it could not meet.
            const std::vector<Diagnostic> misfit = footprintProblems(b);
            if (!misfit.empty())
                QVERIFY2(!unmetRequirements(b, plan.footprint, plan.variants[0]).empty(),
                         (where + ": " + misfit[0].message.c_str() + " yet nothing reported unmet; sized: " +
                          QByteArray::number(plan.variants[0].sized) + ", worst area error " +
                          QByteArray::number(plan.variants[0].metrics.worstAreaError) + ", narrow rooms " +
                          QByteArray::number(plan.variants[0].metrics.narrowRooms))
                             .constData());
        }
        qInfo("%d briefs: %d planned (%d variants checked), %d empty; non-planar %d, disconnected %d, "
              "over footprint %d, too wide %d, sketched %d; slowest %.2f s (%d rooms)",
              count, withPlan, variantsChecked, withoutPlan, mix.nonPlanar, mix.disconnected,
              mix.overFootprint, mix.tooWide, mix.sketched, slowest, slowestRooms);
    }
};

QTEST_GUILESS_MAIN(TestProperties)
#include "tst_properties.moc"
