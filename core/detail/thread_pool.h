// SPDX-License-Identifier: MIT
// A fixed set of worker threads that run a batch of numbered tasks and wait
// for all of them: the plan search runs one round of every annealing chain
// this way. Task k of a batch always does the same work whichever thread
// takes it, so results do not depend on scheduling.
#pragma once

#include <condition_variable>
#include <functional>
#include <mutex>
#include <thread>
#include <vector>

namespace abut::detail {

class ThreadPool {
public:
    // `threads` ≥ 1; the calling thread is one of them.
    explicit ThreadPool(int threads) {
        for (int i = 1; i < threads; ++i) workers_.emplace_back([this] { work(); });
    }
    ~ThreadPool() {
        {
            std::lock_guard<std::mutex> lock(mutex_);
            quit_ = true;
        }
        wake_.notify_all();
        for (std::thread& t : workers_) t.join();
    }
    ThreadPool(const ThreadPool&) = delete;
    ThreadPool& operator=(const ThreadPool&) = delete;

    int threads() const { return static_cast<int>(workers_.size()) + 1; }

    // Runs task(0) … task(count − 1) and returns when all have finished.
    void run(int count, const std::function<void(int)>& task) {
        {
            std::lock_guard<std::mutex> lock(mutex_);
            task_ = &task;
            next_ = 0;
            count_ = count;
            pending_ = count;
            ++batch_;
        }
        wake_.notify_all();
        drain();
        std::unique_lock<std::mutex> lock(mutex_);
        done_.wait(lock, [this] { return pending_ == 0; });
        task_ = nullptr;
    }

private:
    // Takes tasks of the current batch until none is left.
    void drain() {
        for (;;) {
            int k;
            const std::function<void(int)>* task;
            {
                std::lock_guard<std::mutex> lock(mutex_);
                if (!task_ || next_ >= count_) return;
                k = next_++;
                task = task_;
            }
            (*task)(k);
            std::lock_guard<std::mutex> lock(mutex_);
            if (--pending_ == 0) done_.notify_all();
        }
    }
    void work() {
        unsigned long seen = 0;
        for (;;) {
            {
                std::unique_lock<std::mutex> lock(mutex_);
                wake_.wait(lock, [&] { return quit_ || batch_ != seen; });
                if (quit_) return;
                seen = batch_;
            }
            drain();
        }
    }

    std::vector<std::thread> workers_;
    std::mutex mutex_;
    std::condition_variable wake_, done_;
    const std::function<void(int)>* task_ = nullptr;
    int next_ = 0, count_ = 0, pending_ = 0;
    unsigned long batch_ = 0;
    bool quit_ = false;
};

} // namespace abut::detail
