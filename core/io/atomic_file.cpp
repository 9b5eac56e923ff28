// SPDX-License-Identifier: MIT
#include "io/atomic_file.h"

#include <array>
#include <atomic>
#include <cerrno>
#include <chrono>
#include <csignal>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <fstream>
#include <sstream>
#include <vector>

#include <dirent.h>
#include <fcntl.h>
#include <sys/stat.h>
#include <thread>
#include <unistd.h>

namespace abut {

namespace {

std::string folderOf(const std::string& path) {
    const auto slash = path.find_last_of('/');
    if (slash == std::string::npos) return ".";
    return slash == 0 ? "/" : path.substr(0, slash);
}

// The file a write to `given` should replace: a symlink is followed (to its
// final target, which need not exist yet), so the link stays and its target is
// replaced. Empty (with `why`) when the path cannot be resolved.
std::string resolveTarget(const std::string& given, std::string& why) {
    std::string path = given;
    for (int hops = 0; hops < 40; ++hops) {
        struct stat st {};
        if (::lstat(path.c_str(), &st) != 0 || !S_ISLNK(st.st_mode)) return path;
        std::vector<char> buf(4096);
        const ssize_t n = ::readlink(path.c_str(), buf.data(), buf.size() - 1);
        if (n < 0) {
            why = std::string("cannot read the link: ") + std::strerror(errno);
            return {};
        }
        const std::string to(buf.data(), static_cast<std::size_t>(n));
        path = (!to.empty() && to[0] == '/') ? to : folderOf(path) + "/" + to;
    }
    why = "too many levels of symbolic links";
    return {};
}

// Test hook for the command-line tests: ABUT_TEST_WRITE_FAULT=N makes every
// write fail after N bytes, as a full disk would.
std::optional<WriteFault> faultFromEnvironment() {
    const char* v = std::getenv("ABUT_TEST_WRITE_FAULT");
    if (!v || !*v) return std::nullopt;
    char* end = nullptr;
    const unsigned long long n = std::strtoull(v, &end, 10);
    if (*end != '\0') return std::nullopt;
    return WriteFault{static_cast<std::size_t>(n)};
}

// ABUT_TEST_WRITE_PAUSE=MS (a test hook): wait this long after the first
// bytes are written, so that a test can send a signal during a save.
int pauseFromEnvironment() {
    const char* v = std::getenv("ABUT_TEST_WRITE_PAUSE");
    return v && *v ? std::atoi(v) : 0;
}

// Temporary files being written, for the signal handler to remove. A slot is
// claimed with `state` 0 → 1, filled, then published as 2; the handler reads
// only published slots (unlink is async-signal-safe).
struct PendingSlot {
    std::atomic<int> state{0};
    char path[4096];
};
std::array<PendingSlot, 16> pending;

extern "C" void removePendingAndDie(int sig) {
    for (PendingSlot& p : pending)
        if (p.state.load() == 2) ::unlink(p.path);
    std::signal(sig, SIG_DFL);
    std::raise(sig);
}

// On the first save, the usual ways of stopping a program (SIGTERM, SIGINT,
// SIGHUP) get a handler that removes the temporary files, then stops as
// before — unless the program already handles the signal itself.
void installHandlersOnce() {
    static const bool installed = [] {
        for (int sig : {SIGTERM, SIGINT, SIGHUP}) {
            struct sigaction now {};
            if (::sigaction(sig, nullptr, &now) == 0 && now.sa_handler == SIG_DFL) {
                struct sigaction act {};
                act.sa_handler = removePendingAndDie;
                sigemptyset(&act.sa_mask);
                ::sigaction(sig, &act, nullptr);
            }
        }
        return true;
    }();
    (void)installed;
}

class PendingFile {
public:
    explicit PendingFile(const std::string& path) {
        if (path.size() >= sizeof(PendingSlot::path)) return;
        for (PendingSlot& p : pending) {
            int free = 0;
            if (p.state.compare_exchange_strong(free, 1)) {
                std::memcpy(p.path, path.c_str(), path.size() + 1);
                p.state.store(2);
                slot_ = &p;
                return;
            }
        }
    }
    ~PendingFile() {
        if (slot_) slot_->state.store(0);
    }
    PendingFile(const PendingFile&) = delete;
    PendingFile& operator=(const PendingFile&) = delete;

private:
    PendingSlot* slot_ = nullptr;
};

const std::string tempPrefix = ".abut-save-";

} // namespace

int removeStaleTemporaries(const std::string& folder) {
    DIR* dir = ::opendir(folder.empty() ? "." : folder.c_str());
    if (!dir) return 0;
    int removed = 0;
    const auto now = std::chrono::system_clock::now();
    while (const dirent* e = ::readdir(dir)) {
        const std::string name = e->d_name;
        if (name.rfind(tempPrefix, 0) != 0) continue;
        const std::string full = (folder.empty() ? std::string(".") : folder) + "/" + name;
        struct stat st {};
        if (::lstat(full.c_str(), &st) != 0 || !S_ISREG(st.st_mode) || st.st_uid != ::getuid()) continue;
        // ".abut-save-PID-XXXXXX": stale once that process is gone. Without a
        // process number (written before it was part of the name): stale
        // after ten minutes.
        const std::string rest = name.substr(tempPrefix.size());
        const auto dash = rest.find('-');
        bool stale = false;
        if (dash != std::string::npos && dash > 0 && rest.find_first_not_of("0123456789") == dash) {
            const long pid = std::strtol(rest.substr(0, dash).c_str(), nullptr, 10);
            stale = pid > 0 && pid != ::getpid() && ::kill(static_cast<pid_t>(pid), 0) != 0 && errno == ESRCH;
        } else {
            const auto modified = std::chrono::system_clock::from_time_t(st.st_mtime);
            stale = now - modified > std::chrono::minutes(10);
        }
        if (stale && ::unlink(full.c_str()) == 0) ++removed;
    }
    ::closedir(dir);
    return removed;
}

WriteResult writeFileAtomically(const std::string& given, const std::string& data,
                                std::optional<WriteFault> fault) {
    if (!fault) fault = faultFromEnvironment();
    std::string why;
    const std::string path = resolveTarget(given, why);
    if (path.empty()) return {false, given + ": " + why + "; nothing written"};
    {
        // Only regular files are replaced: a device, a pipe or a folder is
        // never renamed over (nor written into: a plan belongs in a file).
        struct stat st {};
        if (::stat(path.c_str(), &st) == 0 && !S_ISREG(st.st_mode))
            return {false, given + ": not a regular file (" +
                               std::string(S_ISDIR(st.st_mode)    ? "a folder"
                                           : S_ISFIFO(st.st_mode) ? "a pipe"
                                           : S_ISCHR(st.st_mode) || S_ISBLK(st.st_mode) ? "a device"
                                                                                        : "a special file") +
                               "); give the path of a file to write"};
    }
    installHandlersOnce();
    removeStaleTemporaries(folderOf(path));
    std::string tmpl = folderOf(path) + "/" + tempPrefix + std::to_string(::getpid()) + "-XXXXXX";
    std::vector<char> name(tmpl.begin(), tmpl.end());
    name.push_back('\0');
    const int fd = ::mkstemp(name.data());
    if (fd < 0)
        return {false, path + ": cannot create a temporary file beside it: " + std::strerror(errno)};
    const std::string tmpPath(name.data());
    const PendingFile pendingFile(tmpPath); // removed by the handler if a signal stops us now
    const int pause = pauseFromEnvironment();

    auto fail = [&](const std::string& why) {
        ::close(fd);
        ::unlink(tmpPath.c_str());
        return WriteResult{false, path + ": " + why + "; the previous file is unchanged"};
    };

    // Keep the permissions of the file being replaced, or the usual 0644.
    struct stat st {};
    const mode_t mode = (::stat(path.c_str(), &st) == 0) ? (st.st_mode & 07777) : 0644;
    ::fchmod(fd, mode);

    std::size_t written = 0;
    while (written < data.size()) {
        std::size_t chunk = data.size() - written;
        if (pause > 0 && written == 0) chunk = (chunk + 1) / 2; // the test hook's pause comes half way
        if (fault && written + chunk > fault->failAfterBytes) {
            chunk = fault->failAfterBytes > written ? fault->failAfterBytes - written : 0;
            if (chunk == 0) return fail("write failed: no space left on device (simulated)");
        }
        const ssize_t n = ::write(fd, data.data() + written, chunk);
        if (n < 0) {
            if (errno == EINTR) continue;
            return fail(std::string("write failed: ") + std::strerror(errno));
        }
        written += static_cast<std::size_t>(n);
        if (pause > 0 && written < data.size()) std::this_thread::sleep_for(std::chrono::milliseconds(pause));
    }
    if (::fsync(fd) != 0) return fail(std::string("flush failed: ") + std::strerror(errno));
    if (::close(fd) != 0) {
        ::unlink(tmpPath.c_str());
        return {false, path + ": close failed: " + std::strerror(errno)};
    }
    if (::rename(tmpPath.c_str(), path.c_str()) != 0) {
        const std::string why = std::strerror(errno);
        ::unlink(tmpPath.c_str());
        return {false, path + ": cannot replace the file: " + why + "; the previous file is unchanged"};
    }
    return {};
}

std::optional<std::string> readFile(const std::string& path, std::string* message) {
    struct stat st {};
    if (::stat(path.c_str(), &st) == 0) {
        if (S_ISDIR(st.st_mode)) {
            if (message) *message = path + ": is a folder, not a file";
            return std::nullopt;
        }
        if (S_ISREG(st.st_mode) && st.st_size > maxReadBytes) {
            if (message)
                *message = path + ": " + std::to_string(st.st_size / (1024 * 1024)) +
                           " MB, larger than the " + std::to_string(maxReadBytes / (1024 * 1024)) +
                           " MB Abut reads";
            return std::nullopt;
        }
    }
    std::ifstream in(path, std::ios::binary);
    if (!in) {
        if (message) *message = path + ": cannot open: " + std::strerror(errno);
        return std::nullopt;
    }
    std::ostringstream ss;
    ss << in.rdbuf();
    if (in.bad()) {
        if (message) *message = path + ": read failed";
        return std::nullopt;
    }
    return ss.str();
}

} // namespace abut
