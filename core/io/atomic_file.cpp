// SPDX-License-Identifier: MIT
#include "io/atomic_file.h"

#include <cerrno>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <fstream>
#include <sstream>
#include <vector>

#include <fcntl.h>
#include <sys/stat.h>
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

} // namespace

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
    std::string tmpl = folderOf(path) + "/.abut-save-XXXXXX";
    std::vector<char> name(tmpl.begin(), tmpl.end());
    name.push_back('\0');
    const int fd = ::mkstemp(name.data());
    if (fd < 0)
        return {false, path + ": cannot create a temporary file beside it: " + std::strerror(errno)};
    const std::string tmpPath(name.data());

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
